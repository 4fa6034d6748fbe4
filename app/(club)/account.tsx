import { AccountScreen } from '@/features/auth/components/account-screen';
import { Page } from '@/features/ui/components/page';
import { Text } from '@/features/ui/components/text';

export default function AccountRoute() {
  return (
    <Page title="Your account">
      <Text variant="title" accessibilityRole="header">
        Your account
      </Text>
      <AccountScreen />
    </Page>
  );
}
