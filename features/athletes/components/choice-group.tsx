import { Pressable, StyleSheet, View } from 'react-native';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';

type Option<T extends string> = { value: T; label: string };

/** A row of large radio chips with a label above and the error beside it. */
export function ChoiceGroup<T extends string>({
  label,
  name,
  options,
  value,
  onChange,
  error,
}: {
  label: string;
  /** Prefix of each option's testID: `${name}-${value}`. */
  name: string;
  options: readonly Option<T>[];
  value: T | '' | null | undefined;
  onChange: (value: T) => void;
  error?: string | false;
}) {
  return (
    <View style={styles.wrap}>
      <Text variant="label" nativeID={`${name}-label`}>
        {label}
      </Text>
      <View style={styles.row} accessibilityRole="radiogroup" accessibilityLabelledBy={`${name}-label`}>
        {options.map((o) => {
          const on = value === o.value;
          return (
            <Pressable
              key={o.value}
              accessibilityRole="radio"
              accessibilityState={{ checked: on }}
              accessibilityLabel={o.label}
              testID={`${name}-${o.value}`}
              onPress={() => onChange(o.value)}
              style={[styles.chip, on && styles.chipOn, error ? styles.chipInvalid : null]}
            >
              <Text style={[styles.text, on && styles.textOn]}>{o.label}</Text>
            </Pressable>
          );
        })}
      </View>
      {error ? (
        <Text variant="small" style={styles.error} accessibilityRole="alert">
          {error}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  chip: {
    minHeight: TOUCH_MIN,
    minWidth: 72,
    justifyContent: 'center',
    alignItems: 'center',
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 2,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
  chipOn: { borderColor: colors.pine, backgroundColor: colors.pine },
  chipInvalid: { borderColor: colors.brick },
  text: { fontFamily: fonts.bold, fontSize: 16, color: colors.ink },
  textOn: { color: '#fff' },
  error: { color: colors.brick, fontFamily: fonts.bold },
});
