import { NewAthlete } from '@/features/athletes/components/new-athlete';
import { Page } from '@/features/ui/components/page';
import { Text } from '@/features/ui/components/text';

export default function NewAthleteScreen() {
  return (
    <Page title="Add an athlete">
      <Text variant="title" accessibilityRole="header">
        Add an athlete
      </Text>
      <NewAthlete />
    </Page>
  );
}
