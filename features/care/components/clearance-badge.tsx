import { StyleSheet, View } from 'react-native';
import { Text } from '@/features/ui/components/text';
import { colors, radius, space } from '@/features/ui/theme';
import { useClearanceOf, usePainWaitingOf } from '../api/get-clearances';
import { CLEARANCE_LABELS } from '../choices';
import type { ClearanceView } from '../types';

const TONE = { cleared: 'ok', modified: 'caution', referred: 'stop' } as const;

/** The physiotherapist's clearance beside an athlete's name. Nothing when none was recorded. */
export function ClearanceBadge({ clearance }: { clearance: ClearanceView }) {
  if (!clearance) return null;
  const tone = TONE[clearance.status];
  const label = CLEARANCE_LABELS[clearance.status];
  return (
    <View
      style={[styles.tag, styles[tone]]}
      testID="clearance-badge"
      accessibilityLabel={`Clearance: ${label}${clearance.detail ? `, ${clearance.detail}` : ''}`}
    >
      <Text variant="small" style={styles.text} numberOfLines={1}>
        {/* Referred on: an arrow out, not a cross (read as a tag's "remove"). */}
        {tone === 'stop' ? '↗ ' : tone === 'caution' ? '⚠ ' : '✓ '}
        {label}
      </Text>
    </View>
  );
}

/**
 * The badge for screens that list athletes without their clearance (rounds, capture, result), and a stop
 * tag while pain reported at the newest screen waits for a physiotherapist's decision.
 */
export function AthleteClearanceBadge({ athleteId }: { athleteId: string }) {
  return (
    <>
      <PainWaitingTag athleteId={athleteId} />
      <ClearanceBadge clearance={useClearanceOf(athleteId)} />
    </>
  );
}

/** Pain reported at the athlete's newest screen with no physiotherapist's decision since; nothing otherwise. */
export function PainWaitingTag({ athleteId }: { athleteId: string }) {
  const pain = usePainWaitingOf(athleteId);
  return pain ? (
    <View style={[styles.tag, styles.stop]} testID="pain-waiting-badge">
      <Text variant="small" style={styles.text} numberOfLines={1}>
        Pain: no physio decision yet
      </Text>
    </View>
  ) : null;
}

const styles = StyleSheet.create({
  tag: { alignSelf: 'flex-start', borderRadius: radius.sm, paddingHorizontal: space.sm, paddingVertical: 2, borderWidth: 1 },
  text: { color: colors.ink, fontWeight: '700' },
  ok: { backgroundColor: colors.pineSoft, borderColor: colors.pine },
  caution: { backgroundColor: colors.amberSoft, borderColor: colors.amber },
  stop: { backgroundColor: colors.brickSoft, borderColor: colors.brick },
});
