import { Pressable, StyleSheet, View } from 'react-native';
import { Text } from './text';
import { colors, radius, space, TOUCH_MIN } from '../theme';

export type Chip<T extends string> = { value: T; label: string };

/** A labelled row of choices, one selected: big enough to hit with a thumb. */
export function Chips<T extends string>({
  label,
  options,
  value,
  onChange,
  testID,
}: {
  label: string;
  options: Chip<T>[];
  value: T;
  onChange: (v: T) => void;
  testID?: string;
}) {
  return (
    <View style={styles.group} role="radiogroup" aria-label={label} testID={testID}>
      <Text variant="small">{label}</Text>
      <View style={styles.row}>
        {options.map((o) => {
          const on = o.value === value;
          return (
            <Pressable
              key={o.value}
              role="radio"
              aria-checked={on}
              onPress={() => onChange(o.value)}
              style={[styles.chip, on && styles.on]}
              testID={testID ? `${testID}-${o.value || 'all'}` : undefined}
            >
              <Text variant="small" style={on ? styles.onText : styles.text}>
                {o.label}
              </Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  chip: {
    minHeight: TOUCH_MIN,
    paddingHorizontal: space.md,
    justifyContent: 'center',
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
  on: { backgroundColor: colors.pine, borderColor: colors.pine },
  text: { color: colors.ink },
  onText: { color: '#fff' },
});
