import { ActivityIndicator, Pressable, StyleSheet, type PressableProps } from 'react-native';
import { colors, fonts, radius, space, TOUCH_MIN } from '../theme';
import { Text } from './text';

type Props = Omit<PressableProps, 'children'> & {
  label: string;
  tone?: 'primary' | 'secondary' | 'danger' | 'quiet';
  busy?: boolean;
};

export function Button({ label, tone = 'primary', busy = false, disabled, style, ...rest }: Props) {
  const inactive = disabled || busy;
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityState={{ disabled: !!inactive, busy }}
      disabled={inactive}
      {...rest}
      style={(state) => [
        styles.base,
        styles[tone],
        state.pressed && styles.pressed,
        inactive && styles.inactive,
        typeof style === 'function' ? style(state) : style,
      ]}
    >
      {busy ? <ActivityIndicator color={tone === 'primary' || tone === 'danger' ? '#fff' : colors.pine} /> : null}
      <Text style={[styles.label, tone === 'primary' || tone === 'danger' ? styles.onDark : styles.onLight]}>{label}</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: TOUCH_MIN,
    paddingHorizontal: space.lg,
    // A label on two lines keeps clear of the border (a long one wraps on a phone).
    paddingVertical: space.sm,
    borderRadius: radius.md,
    alignItems: 'center',
    justifyContent: 'center',
    flexDirection: 'row',
    gap: space.sm,
  },
  primary: { backgroundColor: colors.pine },
  secondary: { backgroundColor: colors.surface, borderWidth: 2, borderColor: colors.pine },
  danger: { backgroundColor: colors.brick },
  quiet: { backgroundColor: 'transparent' },
  pressed: { opacity: 0.8 },
  inactive: { opacity: 0.55 },
  label: { fontFamily: fonts.bold, fontSize: 17 },
  onDark: { color: '#fff' },
  onLight: { color: colors.pine },
});
