import { Pressable, StyleSheet, View } from 'react-native';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';

type Props = {
  label: string;
  checked: boolean;
  onChange(next: boolean): void;
  hint?: string;
  testID?: string;
  tone?: 'normal' | 'caution';
  disabled?: boolean;
};

/** A whole-row tick box, at least 56 px tall: tapped with a thumb, courtside. */
export function TickBox({ label, checked, onChange, hint, testID, tone = 'normal', disabled = false }: Props) {
  return (
    <Pressable
      accessibilityRole="checkbox"
      aria-checked={checked}
      aria-disabled={disabled}
      accessibilityLabel={label}
      accessibilityHint={hint}
      disabled={disabled}
      testID={testID}
      onPress={() => onChange(!checked)}
      style={({ pressed }) => [
        styles.row,
        checked && (tone === 'caution' ? styles.rowCaution : styles.rowChecked),
        pressed && styles.pressed,
        disabled && styles.disabled,
      ]}
    >
      <View style={[styles.box, checked && (tone === 'caution' ? styles.boxCaution : styles.boxChecked)]}>
        {checked ? <Text style={styles.tick}>✓</Text> : null}
      </View>
      <View style={styles.text}>
        <Text>{label}</Text>
        {hint ? <Text variant="small">{hint}</Text> : null}
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  row: {
    minHeight: TOUCH_MIN + 8,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingVertical: space.sm,
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 2,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
  rowChecked: { borderColor: colors.pine, backgroundColor: colors.pineSoft },
  rowCaution: { borderColor: colors.brick, backgroundColor: colors.brickSoft },
  pressed: { opacity: 0.85 },
  disabled: { opacity: 0.5 },
  box: {
    width: 32,
    height: 32,
    borderRadius: radius.sm,
    borderWidth: 2,
    borderColor: colors.inkMuted,
    alignItems: 'center',
    justifyContent: 'center',
    backgroundColor: colors.surface,
  },
  boxChecked: { backgroundColor: colors.pine, borderColor: colors.pine },
  boxCaution: { backgroundColor: colors.brick, borderColor: colors.brick },
  tick: { color: '#fff', fontFamily: fonts.bold, fontSize: 20, lineHeight: 22 },
  text: { flex: 1, gap: 2 },
});
