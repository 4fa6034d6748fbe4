import { StyleSheet, View } from 'react-native';
import type { SaveStatus } from '@/features/screening/draft/draft-store';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space } from '@/features/ui/theme';

export function saveStatusText(status: SaveStatus): string {
  switch (status.kind) {
    case 'saved':
      return '✓ Saved';
    case 'pending':
    case 'saving':
      return 'Saving…';
    case 'kept':
      return 'Kept on this phone';
    case 'retrying':
      return 'Not saved — retrying';
    case 'refused':
      return 'Not saved';
  }
}

/** Always visible while capturing: whether the server has everything typed. */
export function SaveStatusBadge({ status, notKept = 0 }: { status: SaveStatus; notKept?: number }) {
  const bad = status.kind === 'retrying' || status.kind === 'refused' || notKept > 0;
  // Fields holding text out of range are not saved: said here too, where "saved" is read.
  const text = notKept > 0 ? `${notKept === 1 ? '1 field' : `${notKept} fields`} not kept` : saveStatusText(status);
  return (
    <View style={[styles.badge, bad ? styles.bad : status.kind === 'saved' ? styles.ok : styles.busy]} accessibilityLiveRegion="polite" testID="save-status">
      <Text style={[styles.text, bad && styles.badText]}>{text}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: { borderRadius: radius.sm, paddingHorizontal: space.sm, paddingVertical: 2, borderWidth: 1 },
  ok: { borderColor: colors.pine, backgroundColor: colors.pineSoft },
  busy: { borderColor: colors.line, backgroundColor: colors.surface },
  bad: { borderColor: colors.brick, backgroundColor: colors.brickSoft },
  text: { fontFamily: fonts.bold, fontSize: 14, lineHeight: 18, color: colors.ink },
  badText: { color: colors.brick },
});
