import { StyleSheet, View } from 'react-native';
import { space } from '@/features/ui/theme';
import { Button } from './button';
import { Text } from './text';

type Props = {
  /** What will happen, in plain words. */
  text?: string;
  confirmLabel: string;
  cancelLabel: string;
  onConfirm(): void;
  onCancel(): void;
  busy?: boolean;
  testID?: string;
};

/** The second step of a change that cannot be taken back with one tap: what it does, then yes or keep. */
export function Confirm({ text, confirmLabel, cancelLabel, onConfirm, onCancel, busy, testID }: Props) {
  return (
    <View style={styles.wrap}>
      {text ? <Text variant="small">{text}</Text> : null}
      <View style={styles.buttons}>
        <Button tone="danger" label={confirmLabel} testID={testID} busy={busy} onPress={onConfirm} />
        <Button tone="quiet" label={cancelLabel} onPress={onCancel} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { flexBasis: '100%', gap: space.sm },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
