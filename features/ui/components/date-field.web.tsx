import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { colors, fonts, radius, space, TOUCH_MIN } from '../theme';
import type { DateFieldProps } from './date-field';
import { Text } from './text';

/**
 * Web: the browser's own date input, so a phone opens its date picker (a wheel or a calendar) instead
 * of a keyboard, and the value is always YYYY-MM-DD. Shown in the user's locale by the browser.
 */
export function DateField({ label, value, onChange, onBlur, error, hint, testID, min, max }: DateFieldProps) {
  const [focused, setFocused] = useState(false);
  const flat = StyleSheet.flatten([styles.input, focused && styles.focused, error ? styles.invalid : null]);
  return (
    <View style={styles.wrap}>
      <Text variant="label">{label}</Text>
      <input
        type="date"
        aria-label={label}
        aria-invalid={error ? true : undefined}
        data-testid={testID}
        value={value}
        min={min}
        max={max}
        onChange={(e) => onChange(e.currentTarget.value)}
        onFocus={() => setFocused(true)}
        onBlur={() => {
          setFocused(false);
          onBlur?.();
        }}
        style={flat as React.CSSProperties}
      />
      {error ? (
        <Text variant="small" style={styles.error} accessibilityRole="alert">
          {error}
        </Text>
      ) : hint ? (
        <Text variant="small">{hint}</Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  input: {
    minHeight: TOUCH_MIN,
    borderWidth: 2,
    borderStyle: 'solid',
    borderColor: colors.line,
    borderRadius: radius.md,
    paddingHorizontal: space.md,
    fontFamily: fonts.regular,
    fontSize: 18,
    color: colors.ink,
    backgroundColor: colors.surface,
  },
  focused: { borderColor: colors.focus },
  invalid: { borderColor: colors.brick },
  error: { color: colors.brick, fontFamily: fonts.bold },
});
