import { useLocalSearchParams } from 'expo-router';
import { TrainingSheetScreen } from '@/features/training/components/training-sheet';
import { Page } from '@/features/ui/components/page';

export default function TrainingScreen() {
  const { squad } = useLocalSearchParams<{ squad?: string }>();
  return (
    <Page>
      <TrainingSheetScreen initialSquadId={squad ? String(squad) : undefined} />
    </Page>
  );
}
