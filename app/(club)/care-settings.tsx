import { CareSettingsForm } from '@/features/care/components/care-settings-form';
import { Page } from '@/features/ui/components/page';
import { Text } from '@/features/ui/components/text';

export default function CareSettingsScreen() {
  return (
    <Page title="Care settings">
      <Text variant="title" accessibilityRole="header">
        Care settings
      </Text>
      <CareSettingsForm />
    </Page>
  );
}
