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
  // A DOM element takes CSS, not React Native style keys (no paddingHorizontal there).
  const css: React.CSSProperties = {
    minHeight: TOUCH_MIN,
    boxSizing: 'border-box',
    border: `2px solid ${error ? colors.brick : focused ? colors.focus : colors.line}`,
    borderRadius: radius.md,
    padding: `0 ${space.md}px`,
    fontFamily: fonts.regular,
    fontSize: 18,
    color: colors.ink,
    backgroundColor: colors.surface,
  };
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
        style={css}
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
  error: { color: colors.brick, fontFamily: fonts.bold },
});
