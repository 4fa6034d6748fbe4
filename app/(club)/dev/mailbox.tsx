import { Mailbox } from '@/features/mailbox/mailbox';
import { Page } from '@/features/ui/components/page';
import { Text } from '@/features/ui/components/text';

export default function MailboxScreen() {
  return (
    <Page title="Local mailbox">
      <Text variant="title" accessibilityRole="header">
        Local mailbox
      </Text>
      <Mailbox />
    </Page>
  );
}
