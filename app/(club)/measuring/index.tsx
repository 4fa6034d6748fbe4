import { useLocalSearchParams } from 'expo-router';
import { MeasuringDesk } from '@/features/measuring/components/measuring-desk';
import { Page } from '@/features/ui/components/page';

export default function MeasuringScreen() {
  const { roundId } = useLocalSearchParams<{ roundId?: string }>();
  return (
    <Page title="To measure">
      <MeasuringDesk roundId={typeof roundId === 'string' && roundId !== '' ? roundId : undefined} />
    </Page>
  );
}
