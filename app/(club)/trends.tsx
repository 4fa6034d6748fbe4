import { useLocalSearchParams } from 'expo-router';
import { LazySquadTrends } from '@/features/progress/components/lazy-progress';
import { Page } from '@/features/ui/components/page';

export default function TrendsScreen() {
  const { squad } = useLocalSearchParams<{ squad?: string }>();
  return (
    <Page>
      <LazySquadTrends initialSquadId={squad ? String(squad) : undefined} />
    </Page>
  );
}
