import { SquadManager } from '@/features/athletes/components/squad-manager';
import { Page } from '@/features/ui/components/page';
import { Text } from '@/features/ui/components/text';

export default function SquadsScreen() {
  return (
    <Page title="Squads">
      <Text variant="title" accessibilityRole="header">
        Squads
      </Text>
      <SquadManager />
    </Page>
  );
}
