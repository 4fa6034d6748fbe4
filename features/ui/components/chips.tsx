import { Pressable, StyleSheet, View } from 'react-native';
import { Text } from './text';
import { colors, fonts, radius, space, TOUCH_MIN } from '../theme';

export type Chip<T extends string> = { value: T; label: string };

/**
 * A labelled row of choices, one selected (radio semantics), big enough to hit with a thumb. The app's one
 * single-choice control: `filter` for the rows that narrow a view (squad, kind of record), `form` for a
 * form's answer, with bolder text and the field's error under it. Each option's testID is
 * `${testID}-${value}` (`all` for the empty value).
 */
export function Chips<T extends string>({
  label,
  options,
  value,
  onChange,
  testID,
  variant = 'filter',
  error,
}: {
  label: string;
  options: readonly Chip<T>[];
  /** Nothing chosen yet: '' (or null) selects no option unless one has the empty value. */
  value: T | '' | null | undefined;
  onChange: (v: T) => void;
  testID?: string;
  variant?: 'filter' | 'form';
  error?: string | false;
}) {
  const form = variant === 'form';
  return (
    <View style={styles.group} role="radiogroup" aria-label={label} testID={testID}>
      <Text variant={form ? 'label' : 'small'}>{label}</Text>
      <View style={[styles.row, form && styles.formRow]}>
        {options.map((o) => {
          const on = o.value === value;
          return (
            <Pressable
              key={o.value}
              role="radio"
              aria-checked={on}
              onPress={() => onChange(o.value)}
              style={[styles.chip, form && styles.formChip, on && styles.on, error ? styles.invalid : null]}
              testID={testID ? `${testID}-${o.value || 'all'}` : undefined}
            >
              <Text variant={form ? 'body' : 'small'} style={[form && styles.formText, on ? styles.onText : styles.text]}>
                {o.label}
              </Text>
            </Pressable>
          );
        })}
      </View>
      {error ? (
        <Text variant="small" style={styles.error} role="alert">
          {error}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  // Never wider than where it sits: side by side with other rows (the squad trends' filters on a wide
  // screen) its chips ran past the page's edge instead of wrapping.
  group: { gap: space.xs, maxWidth: '100%' },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  formRow: { gap: space.sm },
  chip: {
    minHeight: TOUCH_MIN,
    minWidth: TOUCH_MIN,
    alignItems: 'center',
    paddingHorizontal: space.md,
    justifyContent: 'center',
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
  formChip: { minWidth: 72, alignItems: 'center', borderRadius: radius.md, borderWidth: 2 },
  on: { backgroundColor: colors.pine, borderColor: colors.pine },
  invalid: { borderColor: colors.brick },
  text: { color: colors.ink },
  formText: { fontFamily: fonts.bold, fontSize: 16 },
  onText: { color: '#fff' },
  error: { color: colors.brick, fontFamily: fonts.bold },
});
