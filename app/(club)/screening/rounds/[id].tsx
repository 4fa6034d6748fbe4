import { useLocalSearchParams } from 'expo-router';
import { RoundScreen } from '@/features/screening/components/round-screen';
import { Page } from '@/features/ui/components/page';

export default function RoundRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <Page>
      <RoundScreen id={String(id)} />
    </Page>
  );
}
