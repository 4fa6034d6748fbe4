import { lazy, Suspense } from 'react';
import { Text } from '@/features/ui/components/text';

const Section = lazy(() => import('./athlete-progress'));

/** The history charts (and the chart library) are a separate download: the athlete page opens without them. */
export function LazyAthleteProgress({ athleteId }: { athleteId: string }) {
  return (
    <Suspense fallback={<Text>Loading the history…</Text>}>
      <Section athleteId={athleteId} />
    </Suspense>
  );
}
