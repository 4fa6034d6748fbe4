import { can } from '@/features/access/permissions';
import { Link } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useAthleteAssessmentsQuery } from '@/features/screening/api/get-athlete-assessments';
import type { AthleteAssessmentItem } from '@/features/screening/contract';
import { useActiveClub } from '@/features/session/active-club';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { assessmentHref } from '@/features/screening/assessment-href';
import { SeverityTag, StatusTag } from './status-tag';
import { formatDate } from '@/features/ui/format-date';
import { groupFlags, sidesText } from '@/features/screening/flag-lines';

const newestFirst = (a: AthleteAssessmentItem, b: AthleteAssessmentItem) =>
  b.screenedOn.localeCompare(a.screenedOn) || (b.submittedAt ?? '').localeCompare(a.submittedAt ?? '');

/** Every screening of the athlete, newest first, each with its flags. */
export function AthleteAssessments({ athleteId }: { athleteId: string }) {
  const { membership } = useActiveClub();
  if (!can(membership.role, 'screening.read')) return null;
  return <AssessmentList athleteId={athleteId} screens={can(membership.role, 'screening.write')} />;
}

/** Where "Screenings ↓" under the athlete's name leads. */
export const ATHLETE_SCREENINGS_ANCHOR = 'athlete-screenings';

function AssessmentList({ athleteId, screens }: { athleteId: string; screens: boolean }) {
  const query = useAthleteAssessmentsQuery(athleteId);
  const [showAll, setShowAll] = useState(false);
  const all = query.data?.assessments.slice().sort(newestFirst) ?? [];
  // Rounds the athlete is in but not screened yet say little each: one line, opened on a tap (they buried
  // the screens that were done).
  const notStarted = all.filter((a) => a.status === 'not_started');
  const shown = showAll ? all : all.filter((a) => a.status !== 'not_started');
  return (
    <View nativeID={ATHLETE_SCREENINGS_ANCHOR}>
      <Card testID="athlete-assessments">
        <Text variant="heading" accessibilityRole="header" aria-level={2}>
          Screenings
        </Text>
        {query.isPending ? <Text>Loading screenings…</Text> : null}
        {query.error ? <Notice tone="error">{query.error.message}</Notice> : null}
        {query.data?.assessments.length === 0 ? <Text>No screening yet.</Text> : null}
        {notStarted.length > 0 && !showAll ? (
          <Button
            tone="quiet"
            label={`Also in ${notStarted.length} ${notStarted.length === 1 ? 'round' : 'rounds'} not started yet: show ${notStarted.length === 1 ? 'it' : 'them'}`}
            onPress={() => setShowAll(true)}
            testID="athlete-assessments-not-started"
          />
        ) : null}
        {shown.map((a) => {
          const inner = (
            <View style={styles.inner}>
              <View style={styles.head}>
                <Text variant="label" style={styles.title}>
                  {a.roundName}
                </Text>
                <Text variant="small">{formatDate(a.screenedOn)}</Text>
              </View>
              <StatusTag status={a.status} />
              {a.result ? (
                a.result.flags.length === 0 ? (
                  <Text variant="small">No flags.</Text>
                ) : (
                  <View style={styles.flags}>
                    {groupFlags(a.result.flags).map((g) => (
                      <View key={g.key} style={styles.flag}>
                        <SeverityTag severity={g.flag.severity} />
                        <Text variant="small" style={styles.flagText}>
                          <Text variant="small" style={styles.flagTitle}>
                            {g.flag.title}
                          </Text>
                          {[sidesText(g.sides), g.count > 1 ? `${g.count} findings` : '']
                            .filter(Boolean)
                            .map((t) => ` · ${t}`)
                            .join('')}
                        </Text>
                      </View>
                    ))}
                  </View>
                )
              ) : null}
            </View>
          );
          return (
            <Link key={a.assessmentId} href={assessmentHref(a, screens)} style={styles.row} testID={`athlete-assessment-${a.assessmentId}`}>
              {inner}
            </Link>
          );
        })}
      </Card>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { minHeight: TOUCH_MIN, borderTopWidth: 1, borderTopColor: colors.line, paddingVertical: space.md, borderRadius: radius.sm },
  inner: { gap: space.xs, width: '100%' },
  head: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm, flexWrap: 'wrap' },
  title: { flexShrink: 1 },
  flags: { gap: space.xs },
  flag: { flexDirection: 'row', alignItems: 'flex-start', gap: space.sm },
  flagText: { flex: 1, color: colors.ink },
  flagTitle: { color: colors.ink, fontFamily: fonts.bold },
});
