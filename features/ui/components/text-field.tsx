import { useRef, useState } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { colors, fonts, radius, space, TOUCH_MIN } from '../theme';
import { useTypedBeforeStart } from '../use-typed-before-start';
import { Text } from './text';

type Props = TextInputProps & { label: string; error?: string | false; hint?: string; testID?: string };

/** A labelled input with its error shown right under it. */
export function TextField({ label, error, hint, style, testID, ...rest }: Props) {
  const [focused, setFocused] = useState(false);
  const input = useRef<TextInput>(null);
  useTypedBeforeStart(input, label, rest.value, rest.onChangeText);
  return (
    <View style={styles.wrap}>
      <Text variant="label">{label}</Text>
      <TextInput
        ref={input}
        accessibilityLabel={label}
        testID={testID}
        placeholderTextColor={colors.inkMuted}
        {...rest}
        onFocus={(e) => {
          setFocused(true);
          rest.onFocus?.(e);
        }}
        onBlur={(e) => {
          setFocused(false);
          rest.onBlur?.(e);
        }}
        style={[styles.input, focused && styles.focused, error ? styles.invalid : null, style]}
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
