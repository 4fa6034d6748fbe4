import { lazy, Suspense } from 'react';
import { Text } from '@/features/ui/components/text';

const Screen = lazy(() => import('./result-screen'));

/** The result screen (plan, library, overlays) is a separate download. */
export function LazyResultScreen({ assessmentId, from }: { assessmentId: string; from?: 'reviews' }) {
  return (
    <Suspense fallback={<Text>Loading the result…</Text>}>
      <Screen assessmentId={assessmentId} from={from} />
    </Suspense>
  );
}
