import { AthleteList } from '@/features/athletes/components/athlete-list';
import { Page } from '@/features/ui/components/page';
import { Text } from '@/features/ui/components/text';

export default function AthletesScreen() {
  return (
    <Page title="Athletes">
      <Text variant="title" accessibilityRole="header">
        Athletes
      </Text>
      <AthleteList />
    </Page>
  );
}
