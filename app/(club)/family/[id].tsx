import { useLocalSearchParams } from 'expo-router';
import { FamilyView } from '@/features/care/components/family-view';
import { Page } from '@/features/ui/components/page';

export default function FamilyScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <Page>
      <FamilyView athleteId={String(id)} />
    </Page>
  );
}
