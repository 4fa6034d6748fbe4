import { lazy, Suspense } from 'react';
import { Text } from '@/features/ui/components/text';

// The one way into the screens that draw charts. Both load from one module behind one `import()`, so
// the chart library (victory-native and its d3 parts) is one separate download that only these two
// screens fetch. Two separate `import()`s that both reach the library would make Metro move it into
// the chunk shared by every page, the sign-in page included.
const load = () => import('./progress-views');
const AthleteSection = lazy(() => load().then((m) => ({ default: m.AthleteProgress })));
const TrendsScreen = lazy(() => load().then((m) => ({ default: m.SquadTrends })));

/** The athlete's history charts: the athlete page opens without them. */
export function LazyAthleteProgress({ athleteId }: { athleteId: string }) {
  return (
    <Suspense fallback={<Text>Loading the history…</Text>}>
      <AthleteSection athleteId={athleteId} />
    </Suspense>
  );
}

/** The squad trends view and its charts. */
export function LazySquadTrends({ initialSquadId, start }: { initialSquadId?: string; start?: { sort?: string; band?: string } }) {
  return (
    <Suspense fallback={<Text>Loading squad trends…</Text>}>
      <TrendsScreen initialSquadId={initialSquadId} start={start} />
    </Suspense>
  );
}
