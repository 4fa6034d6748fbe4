import { useLocalSearchParams } from 'expo-router';
import { LazyResultScreen } from '@/features/screening/components/result/lazy-result-screen';
import { Page } from '@/features/ui/components/page';

export default function ResultRoute() {
  const { id, from } = useLocalSearchParams<{ id: string; from?: string }>();
  return (
    <Page>
      <LazyResultScreen assessmentId={String(id)} from={from === 'reviews' ? 'reviews' : undefined} />
    </Page>
  );
}
