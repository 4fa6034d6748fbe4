import { StyleSheet, View } from 'react-native';
import { colors, radius, space } from '../theme';
import { Text } from './text';

type Tone = 'info' | 'caution' | 'error';

/** A boxed message: errors, safety cautions, and plain information. */
export function Notice({ tone = 'info', title, children, testID }: { tone?: Tone; title?: string; children: React.ReactNode; testID?: string }) {
  return (
    <View
      testID={testID}
      accessibilityRole={tone === 'error' ? 'alert' : undefined}
      style={[styles.box, tone === 'info' ? styles.info : tone === 'caution' ? styles.caution : styles.error]}
    >
      {title ? <Text variant="label">{title}</Text> : null}
      {typeof children === 'string' ? <Text>{children}</Text> : children}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderRadius: radius.md, padding: space.md, gap: space.xs, borderLeftWidth: 6 },
  info: { backgroundColor: colors.pineSoft, borderLeftColor: colors.pine },
  caution: { backgroundColor: colors.amberSoft, borderLeftColor: colors.amber },
  error: { backgroundColor: colors.brickSoft, borderLeftColor: colors.brick },
});
