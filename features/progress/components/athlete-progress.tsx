import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useActiveClub } from '@/features/session/active-club';
import { can } from '@/features/access/permissions';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, space } from '@/features/ui/theme';
import { useAthleteProgressQuery } from '../api/get-athlete-progress';
import { historySeries } from '../history';
import type { ProgressResponse } from '../progress-types';
import { coachSummary, planTimeSentence, sessionsSentence, sessionsSinceSentence } from '../wording';
import { HistoryChart } from './history-chart';
import { formatDate } from '@/features/ui/format-date';

/** The athlete's screens over time: the last two compared in plain words, then one chart per measurement. */
export default function AthleteProgress({ athleteId }: { athleteId: string }) {
  const { membership } = useActiveClub();
  const allowed = can(membership.role, 'progress.read');
  const query = useAthleteProgressQuery(athleteId, allowed);
  if (!allowed) return null;
  if (query.isPending) return <Text>Loading the history…</Text>;
  if (query.error) return <Notice tone="error">{query.error.message}</Notice>;
  return <ProgressBody progress={query.data} />;
}

function ProgressBody({ progress }: { progress: ProgressResponse }) {
  const { isTabletUp, isWide } = useBreakpoints();
  const series = useMemo(() => historySeries(progress), [progress]);
  if (progress.screens.length === 0) {
    return (
      <Card testID="athlete-progress">
        <Text variant="heading">Progress over time</Text>
        <Text>No submitted screen yet.</Text>
      </Card>
    );
  }
  return (
    <View style={styles.wrap} testID="athlete-progress">
      <Text variant="heading" accessibilityRole="header" aria-level={2}>
        Progress over time
      </Text>
      <Comparison progress={progress} />
      <SinceNewest progress={progress} />
      <View style={[styles.grid, isTabletUp && styles.gridWide]}>
        {series.map((s) => (
          <View key={s.key} style={isWide ? styles.third : isTabletUp ? styles.half : undefined}>
            <HistoryChart series={s} />
          </View>
        ))}
      </View>
      <Text variant="small">
        Thresholds and measuring errors come from adult studies (Herrington and Munro 2010; Munro, Herrington and Carolan 2012; Powden, Hoch and Hoch 2015) and
        are applied to juniors for want of junior figures. Screening is not a diagnosis.
      </Text>
    </View>
  );
}

/** The corrective work done since the newest screen (the training sheet's record), where there is some to count. */
function SinceNewest({ progress }: { progress: ProgressResponse }) {
  const line = sessionsSinceSentence(progress.sessionsSinceLatest, progress.screens.at(-1));
  if (!line) return null;
  return (
    <Card testID="sessions-since">
      <Text>{line}</Text>
    </Card>
  );
}

function Comparison({ progress }: { progress: ProgressResponse }) {
  const [showWithin, setShowWithin] = useState(false);
  const c = progress.comparison;
  if (!c) {
    return (
      <Card>
        <Text>One screen so far: the comparison appears after the next one.</Text>
      </Card>
    );
  }
  const earlier = progress.screens.find((s) => s.assessmentId === c.earlierAssessmentId);
  const later = progress.screens.find((s) => s.assessmentId === c.laterAssessmentId);
  const summary = coachSummary(c);
  return (
    <Card testID="progress-comparison">
      <Text variant="label">
        {earlier?.roundName} ({formatDate(c.earlierScreenedOn)}) compared with {later?.roundName} ({formatDate(c.laterScreenedOn)})
      </Text>
      <Text testID="plan-time">{planTimeSentence(c)}</Text>
      {sessionsSentence(progress.sessionsBetween, c) ? <Text testID="sessions-between">{sessionsSentence(progress.sessionsBetween, c)}</Text> : null}
      {summary.lines.map((l) => (
        <Text key={l}>{l}</Text>
      ))}
      <Text variant="label">{summary.headline}</Text>
      {summary.realChanges.map((l) => (
        <Text key={l} style={styles.real}>
          • {l}
        </Text>
      ))}
      {summary.withinError.length ? (
        <Button
          tone="quiet"
          label={showWithin ? 'Hide the changes within measuring error' : `Show the ${summary.withinError.length} changes within measuring error`}
          onPress={() => setShowWithin((v) => !v)}
        />
      ) : null}
      {showWithin
        ? summary.withinError.map((l) => (
            <Text key={l} variant="small">
              • {l}
            </Text>
          ))
        : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  grid: { gap: space.md },
  gridWide: { flexDirection: 'row', flexWrap: 'wrap' },
  half: { flexBasis: '48%', flexGrow: 1, minWidth: 280 },
  third: { flexBasis: '31%', flexGrow: 1, minWidth: 280 },
  real: { color: colors.ink },
});
