import { lazy, Suspense } from 'react';
import { Text } from '@/features/ui/components/text';

const Screen = lazy(() => import('./squad-trends'));

/** The trends view and its chart library are a separate download. */
export function LazySquadTrends({ initialSquadId }: { initialSquadId?: string }) {
  return (
    <Suspense fallback={<Text>Loading squad trends…</Text>}>
      <Screen initialSquadId={initialSquadId} />
    </Suspense>
  );
}
