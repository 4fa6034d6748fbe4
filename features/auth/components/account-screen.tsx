import { StyleSheet, View } from 'react-native';
import { ROLE_LABELS } from '@/features/access/permissions';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Card } from '@/features/ui/components/card';
import { Text } from '@/features/ui/components/text';
import { space } from '@/features/ui/theme';
import { ChangePasswordForm } from './change-password-form';

/** The signed-in person's own account: who they are in which club, and their password. */
export function AccountScreen() {
  const { me } = useActiveClub();
  const { isWide } = useBreakpoints();
  return (
    <View style={[styles.body, isWide && styles.bodyWide]}>
      <Card style={[styles.part, isWide && styles.partWide]} testID="account-details">
        <Text variant="heading">You</Text>
        <Text variant="label">{me.user.displayName}</Text>
        <Text>{me.user.email}</Text>
        {me.memberships.map((m) => (
          <Text key={m.clubId} variant="small">
            {ROLE_LABELS[m.role]} at {m.clubName}
          </Text>
        ))}
      </Card>
      <Card style={[styles.part, isWide && styles.partWide]}>
        <Text variant="heading">Password</Text>
        <ChangePasswordForm />
      </Card>
    </View>
  );
}

const styles = StyleSheet.create({
  body: { gap: space.lg },
  bodyWide: { flexDirection: 'row', alignItems: 'flex-start' },
  part: { gap: space.sm },
  // Side by side on a wide screen only: in a column, flex would share the height out and cut the form.
  partWide: { flex: 1 },
});
