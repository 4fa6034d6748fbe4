import { Pressable, StyleSheet, View } from 'react-native';
import { Text } from '@/features/ui/components/text';
import { colors, radius, space, TOUCH_MIN } from '@/features/ui/theme';

/** A row of large single-choice buttons (radio semantics). */
export function ChoiceChips<T extends string>({
  label,
  options,
  value,
  onChange,
  testID,
}: {
  label: string;
  options: readonly { value: T; label: string }[];
  value: T | '';
  onChange: (value: T) => void;
  testID?: string;
}) {
  return (
    <View style={styles.wrap} accessibilityRole="radiogroup" accessibilityLabel={label} testID={testID}>
      <Text variant="label">{label}</Text>
      <View style={styles.row}>
        {options.map((o) => {
          const selected = o.value === value;
          return (
            <Pressable
              key={o.value}
              accessibilityRole="radio"
              accessibilityState={{ checked: selected }}
              onPress={() => onChange(o.value)}
              style={[styles.chip, selected && styles.selected]}
            >
              <Text style={selected ? styles.selectedText : undefined}>{o.label}</Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  chip: {
    minHeight: TOUCH_MIN,
    justifyContent: 'center',
    paddingHorizontal: space.lg,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
  selected: { backgroundColor: colors.pine, borderColor: colors.pine },
  selectedText: { color: '#fff', fontWeight: '700' },
});
