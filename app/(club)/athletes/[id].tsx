import { useLocalSearchParams } from 'expo-router';
import { AthleteProfile } from '@/features/athletes/components/athlete-profile';
import { Page } from '@/features/ui/components/page';

export default function AthleteScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <Page>
      <AthleteProfile id={String(id)} />
    </Page>
  );
}
