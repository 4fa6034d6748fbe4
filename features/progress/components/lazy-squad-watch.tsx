import { lazy, Suspense } from 'react';

const Watch = lazy(() => import('./squad-watch').then((m) => ({ default: m.SquadWatchCard })));

/** The squads' numbers load with their own code after the home has painted (it stays out of the first chunk). */
export function LazySquadWatch() {
  return (
    <Suspense fallback={null}>
      <Watch />
    </Suspense>
  );
}
