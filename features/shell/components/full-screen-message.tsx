import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { Text } from '@/features/ui/components/text';
import { colors, space } from '@/features/ui/theme';

export function FullScreenMessage({ busy = false, message }: { busy?: boolean; message?: string }) {
  return (
    <View style={styles.wrap}>
      {busy ? <ActivityIndicator size="large" color={colors.pine} accessibilityLabel="Loading" /> : null}
      {message ? <Text style={styles.text}>{message}</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { flex: 1, alignItems: 'center', justifyContent: 'center', gap: space.lg, padding: space.xl, backgroundColor: colors.paper },
  text: { textAlign: 'center', maxWidth: 420 },
});
