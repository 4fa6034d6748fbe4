import { can } from '@/features/access/permissions';
import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { useRoundQuery } from '@/features/screening/api/get-round';
import { useActiveClub } from '@/features/session/active-club';
import type { RoundAthlete } from '@/features/screening/contract';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { RoundProgress } from './round-progress';
import { PlainTag, StatusTag } from './status-tag';

const byName = (a: RoundAthlete, b: RoundAthlete) =>
  a.lastName.localeCompare(b.lastName) || a.firstName.localeCompare(b.firstName);

/** Submitted: the result. Otherwise the capture screens, for those who screen; others see the result page. */
export function assessmentHref(a: Pick<RoundAthlete, 'assessmentId' | 'status'>, screens = true): string {
  return a.status === 'submitted' || !screens
    ? `/screening/assessments/${a.assessmentId}/result`
    : `/screening/assessments/${a.assessmentId}`;
}

/** One round: its athletes with their progress, big rows to tap, and the next athlete to screen. */
export function RoundScreen({ id }: { id: string }) {
  const round = useRoundQuery(id);
  const { isTabletUp } = useBreakpoints();
  const screens = can(useActiveClub().membership.role, 'screening.write');
  if (round.isPending) return <Text>Loading the round…</Text>;
  if (round.error) return <Notice tone="error">{round.error.message}</Notice>;
  const { round: r, athletes } = round.data;
  const sorted = athletes.slice().sort(byName);
  const next = screens ? (sorted.find((a) => a.status === 'in_progress') ?? sorted.find((a) => a.status === 'not_started')) : undefined;
  return (
    <View style={styles.wrap}>
      <Link href="/screening" style={styles.back}>
        <Text variant="label" style={styles.backText}>
          ← All rounds
        </Text>
      </Link>
      <View style={styles.head}>
        <Text variant="small">
          {r.squadName} · {r.screenedOn}
        </Text>
        <Text variant="title" accessibilityRole="header">
          {r.name}
        </Text>
        <RoundProgress round={r} />
      </View>
      {next ? (
        <Link href={assessmentHref(next)} style={styles.next} testID="screen-next">
          <View style={styles.nextInner}>
            <Text style={styles.nextLabel}>{next.status === 'in_progress' ? 'Continue screening' : 'Screen next'}</Text>
            <Text style={styles.nextName}>
              {next.firstName} {next.lastName} →
            </Text>
          </View>
        </Link>
      ) : screens || round.data.round.counts.submitted === athletes.length ? (
        <Notice title="Everyone is screened">Every athlete of this round has been submitted.</Notice>
      ) : null}
      <Card style={styles.list}>
        <Text variant="heading">Athletes ({athletes.length})</Text>
        <View style={isTabletUp ? styles.grid : undefined}>
          {sorted.map((a) => (
            <Link
              key={a.assessmentId}
              href={assessmentHref(a, screens)}
              style={[styles.row, isTabletUp && styles.rowGrid]}
              testID={`round-athlete-${a.athleteId}`}
              accessibilityLabel={`${a.firstName} ${a.lastName}, ${a.status.replace('_', ' ')}${a.photoConsent ? '' : ', no photo consent'}`}
            >
              <View style={styles.rowInner}>
                <View style={styles.rowMain}>
                  <Text variant="label" style={styles.name}>
                    {a.firstName} {a.lastName}
                  </Text>
                  <View style={styles.tags}>
                    <StatusTag status={a.status} />
                    {a.status === 'submitted' && a.flagCount !== null ? (
                      <PlainTag tone="info" label={a.flagCount === 0 ? 'No flags' : `${a.flagCount} ${a.flagCount === 1 ? 'flag' : 'flags'}`} />
                    ) : null}
                    {!a.photoConsent ? <PlainTag label="No photo consent" /> : null}
                  </View>
                </View>
                <Text style={styles.chevron}>›</Text>
              </View>
            </Link>
          ))}
        </View>
      </Card>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  back: { minHeight: TOUCH_MIN, justifyContent: 'center', paddingVertical: space.md },
  backText: { color: colors.pine },
  head: { gap: space.xs },
  next: { backgroundColor: colors.pine, borderRadius: radius.lg, padding: space.lg, minHeight: TOUCH_MIN + 24 },
  nextInner: { gap: 2 },
  nextLabel: { color: '#fff', fontFamily: fonts.regular, fontSize: 16 },
  nextName: { color: '#fff', fontFamily: fonts.bold, fontSize: 22, lineHeight: 28 },
  list: { gap: space.sm },
  grid: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg },
  row: { minHeight: TOUCH_MIN + 20, borderTopWidth: 1, borderTopColor: colors.line, paddingVertical: space.md },
  rowGrid: { flexBasis: 320, flexGrow: 1 },
  rowInner: { flexDirection: 'row', alignItems: 'center', gap: space.md, width: '100%' },
  rowMain: { flex: 1, gap: space.xs },
  name: { fontSize: 18 },
  tags: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  chevron: { fontFamily: fonts.bold, fontSize: 28, color: colors.inkMuted },
});
