import { PeoplePanel } from '@/features/people/components/people-panel';
import { Page } from '@/features/ui/components/page';
import { Text } from '@/features/ui/components/text';

export default function PeopleScreen() {
  return (
    <Page title="People">
      <Text variant="title" accessibilityRole="header">
        People
      </Text>
      <PeoplePanel />
    </Page>
  );
}
