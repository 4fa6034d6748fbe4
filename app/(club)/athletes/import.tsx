import { RosterImportGate } from '@/features/athletes/components/roster-import-gate';
import { Page } from '@/features/ui/components/page';
import { Text } from '@/features/ui/components/text';

export default function ImportRosterScreen() {
  return (
    <Page title="Import athletes">
      <Text variant="title" accessibilityRole="header">
        Import athletes from a CSV file
      </Text>
      <RosterImportGate />
    </Page>
  );
}
