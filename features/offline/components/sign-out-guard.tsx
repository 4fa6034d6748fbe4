import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { space } from '@/features/ui/theme';
import { wipeOnSignOut } from '../device-handle';
import { useOutboxState } from '../device-handle';

/**
 * The sign-out button of the shell. With changes still waiting on this phone it warns first: signing
 * out removes everything Squadline keeps on the device (drafts, photos, queued submits, kept rounds).
 */
export function SignOutButton({ busy, onSignOut }: { busy: boolean; onSignOut(): void }) {
  const waiting = useOutboxState().entries.length;
  const [asking, setAsking] = useState(false);
  const signOut = () => {
    setAsking(false);
    void wipeOnSignOut().finally(onSignOut);
  };
  if (asking && waiting > 0) {
    const what = waiting === 1 ? '1 change made on this phone is' : `${waiting} changes made on this phone are`;
    return (
      <View style={styles.wrap}>
        <Notice tone="caution" title="Not everything is on the server" testID="sign-out-warning">
          <Text>{`${what} not on the server yet. Signing out deletes ${waiting === 1 ? 'it' : 'them'} from this phone. Stay signed in and connect to send ${waiting === 1 ? 'it' : 'them'} first.`}</Text>
        </Notice>
        <Button label="Stay signed in" testID="sign-out-cancel" onPress={() => setAsking(false)} />
        <Button tone="secondary" label="Delete and sign out" testID="sign-out-confirm" busy={busy} onPress={signOut} />
      </View>
    );
  }
  return <Button tone="secondary" label="Sign out" testID="sign-out" busy={busy} onPress={() => (waiting > 0 ? setAsking(true) : signOut())} />;
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
});
