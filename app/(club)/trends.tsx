import { useLocalSearchParams } from 'expo-router';
import { LazySquadTrends } from '@/features/progress/components/lazy-progress';
import { Page } from '@/features/ui/components/page';

export default function TrendsScreen() {
  // `sort` and `band`: the head coach's "What to act on" lines open the table sorted or filtered to who.
  const { squad, sort, band } = useLocalSearchParams<{ squad?: string; sort?: string; band?: string }>();
  return (
    <Page>
      <LazySquadTrends
        initialSquadId={squad ? String(squad) : undefined}
        start={{ sort: sort ? String(sort) : undefined, band: band ? String(band) : undefined }}
      />
    </Page>
  );
}
