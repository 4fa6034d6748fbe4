import { StyleSheet, View } from 'react-native';
import type { AssessmentStatus } from '@/features/screening/contract';
import type { Severity } from '@/features/screening/engine';
import { SEVERITY_LABELS, STATUS_LABELS } from '@/features/screening/labels';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space } from '@/features/ui/theme';

// A symbol and words, never colour alone.
const STATUS_MARK: Record<AssessmentStatus, string> = { not_started: '○', in_progress: '◐', submitted: '✓' };

export function StatusTag({ status }: { status: AssessmentStatus }) {
  return (
    <View style={[styles.tag, styles[status]]}>
      <Text style={[styles.text, status === 'submitted' && styles.textOnDark]}>
        {STATUS_MARK[status]} {STATUS_LABELS[status]}
      </Text>
    </View>
  );
}

export function SeverityTag({ severity, count }: { severity: Severity; count?: number }) {
  return (
    <View style={[styles.tag, severity === 'concern' ? styles.concern : styles.watch]}>
      <Text style={[styles.text, styles.textOnDark]}>
        {severity === 'concern' ? '▲▲' : '▲'} {count !== undefined ? `${count} ` : ''}
        {SEVERITY_LABELS[severity]}
      </Text>
    </View>
  );
}

export function PlainTag({ label, tone = 'caution' }: { label: string; tone?: 'caution' | 'info' }) {
  return (
    <View style={[styles.tag, tone === 'caution' ? styles.caution : styles.info]}>
      <Text style={[styles.text, tone === 'caution' && styles.cautionText]}>{label}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  tag: { borderRadius: radius.sm, paddingHorizontal: space.sm, paddingVertical: 3, alignSelf: 'flex-start', borderWidth: 1 },
  text: { fontFamily: fonts.bold, fontSize: 14, lineHeight: 18, color: colors.ink },
  textOnDark: { color: '#fff' },
  not_started: { backgroundColor: colors.surface, borderColor: colors.inkMuted },
  in_progress: { backgroundColor: colors.amberSoft, borderColor: colors.amber },
  submitted: { backgroundColor: colors.pine, borderColor: colors.pine },
  watch: { backgroundColor: colors.amber, borderColor: colors.amber },
  concern: { backgroundColor: colors.brick, borderColor: colors.brick },
  caution: { backgroundColor: colors.amberSoft, borderColor: colors.amber },
  cautionText: { color: colors.amber },
  info: { backgroundColor: colors.pineSoft, borderColor: colors.pine },
});
