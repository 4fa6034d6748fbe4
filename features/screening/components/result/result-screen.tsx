import { AthleteClearanceBadge } from '@/features/care/components/clearance-badge';
import { useAssessmentCareQuery } from '@/features/care/api/assessment-care';
import { CARE_ANCHOR, ResultCarePanel } from '@/features/care/components/result-care-panel';
import { can } from '@/features/access/permissions';
import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { useAssessmentQuery } from '@/features/screening/api/get-assessment';
import { useRoundQuery } from '@/features/screening/api/get-round';
import type { AssessmentDetail, PhotoView, ResultView } from '@/features/screening/contract';
import type { Flag, TaskId } from '@/features/screening/engine';
import { groupFlags } from '@/features/screening/flag-groups';
import { nextUnscreened } from '@/features/screening/round-order';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { usableOneRepMax } from '@/features/screening/one-rep-max';
import { Button } from '@/features/ui/components/button';
import { scrollToId } from '@/features/ui/scroll-to';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { FlagCard } from './flag-card';
import { PlanSection } from './plan-section';
import { ResultPhotos } from './result-photos';
import { formatDate } from '@/features/ui/format-date';

/** The result of a submitted assessment: flags, photos with their lines, the plan and its cautions. */
export default function ResultScreen({ assessmentId, from }: { assessmentId: string; from?: 'reviews' }) {
  const query = useAssessmentQuery(assessmentId);
  const care = useAssessmentCareQuery(assessmentId);
  const { membership } = useActiveClub();
  const { isWide } = useBreakpoints();
  if (query.isPending) return <Text>Loading the result…</Text>;
  if (query.error) return <Notice tone="error">{query.error.message}</Notice>;
  const detail = query.data;
  const result = detail.result;
  const name = `${detail.athlete.firstName} ${detail.athlete.lastName}`;
  if (!result) {
    return (
      <View style={styles.wrap}>
        <View style={styles.head}>
          <BackLink detail={detail} from={from} />
          <Text variant="title" accessibilityRole="header">
            {name}
          </Text>
        </View>
        <Notice title="Not submitted yet">This assessment has no result yet.</Notice>
        {can(membership.role, 'screening.write') ? (
          <Link href={`/screening/assessments/${detail.id}`} style={styles.action}>
            <Text style={styles.actionText}>Continue screening →</Text>
          </Link>
        ) : null}
      </View>
    );
  }
  const canEdit = can(membership.role, 'screening.write');
  // Those who review (physiotherapist, head coach) find the review, clearance and notes beside the flags
  // on a wide screen, and by a link under the name on a phone; for the others they follow the plan.
  const reviews = can(membership.role, 'review.read');
  const carePanel = <ResultCarePanel assessmentId={detail.id} athleteId={detail.athlete.id} />;
  return (
    <View style={styles.wrap} testID="result">
      <Header detail={detail} result={result} name={name} canEdit={canEdit} from={from} toCare={reviews} />
      {/* A tester moves on from here: under the name, not below the whole result (a long scroll on a phone,
          and the photos and care notes that arrive later no longer move it while it is tapped). */}
      {canEdit ? <RoundNavigation detail={detail} /> : null}
      <View style={[styles.columns, isWide && styles.columnsWide]}>
        <View style={[styles.column, isWide && styles.columnWide]}>
          <Flags flags={result.result.flags} note={anglesNote(detail)} />
          {reviews && isWide ? carePanel : null}
          {/* On a phone the photos follow the plan: the plan is what the coach acts on. */}
          {isWide ? <ResultPhotos detail={detail} /> : null}
        </View>
        <View style={[styles.column, isWide && styles.columnWide]}>
          <PlanSection
            assessmentId={detail.id}
            result={result}
            oneRepMaxKg={usableOneRepMax(detail.draft)}
            questionedOneRepMaxKg={usableOneRepMax(detail.draft) == null ? detail.draft.oneRepMaxKg : null}
            massKg={detail.draft.body?.massKg}
            canAdjust={can(membership.role, 'plan.adjust')}
            canOverride={can(membership.role, 'plan.override')}
            hold={care.data ? { block: care.data.care.block, clearance: care.data.care.clearance } : care.error ? 'unknown' : 'pending'}
            oneRepMaxHref={canEdit && !detail.roundClosedAt ? `/screening/assessments/${detail.id}?step=body` : undefined}
          />
          {reviews && isWide ? null : carePanel}
          {isWide ? null : <ResultPhotos detail={detail} />}
          {result.history.length > 0 ? (
            <View style={styles.history}>
              <Text variant="label">Earlier results</Text>
              {result.history.map((h) => (
                <Text key={h.id} variant="small">
                  Version {h.version} · {formatDate(h.createdAt)} · engine {h.engineVersion}
                </Text>
              ))}
            </View>
          ) : null}
        </View>
      </View>
    </View>
  );
}

/** Straight on to the next athlete still to be screened in this round (back to the round: the header's link). */
function RoundNavigation({ detail }: { detail: AssessmentDetail }) {
  const round = useRoundQuery(detail.roundId);
  const next = round.data ? nextUnscreened(round.data.athletes, detail.id) : null;
  return (
    <View style={styles.nav} testID="round-navigation">
      {next ? (
        <Link href={`/screening/assessments/${next.assessmentId}`} style={styles.primary} testID="next-athlete">
          <Text style={styles.primaryText}>
            Next athlete: {next.firstName} {next.lastName} →
          </Text>
        </Link>
      ) : round.data ? (
        <Text testID="round-done">Everyone else in this round has been screened.</Text>
      ) : (
        // The button's room while the round is asked for, so that its arrival moves nothing.
        <View style={styles.primaryRoom} />
      )}
    </View>
  );
}

/** Back where the reader came from, above the athlete's name: the review list, or the assessment's round. */
function BackLink({ detail, from }: { detail: AssessmentDetail; from?: 'reviews' }) {
  if (from === 'reviews') {
    return (
      <Link href="/reviews" style={styles.back} testID="back-to-reviews">
        <Text variant="label" style={styles.backText}>
          ← To review
        </Text>
      </Link>
    );
  }
  return (
    <Link href={`/screening/rounds/${detail.roundId}`} style={styles.back} testID="back-to-round">
      <Text variant="label" style={styles.backText}>
        ← {detail.roundName}
      </Text>
    </Link>
  );
}

/** The engine's pain caution, first sentence ("Pain was reported during: …."), for the top of the page. */
function painLine(result: ResultView): string | null {
  const caution = result.result.plan.cautions.find((c) => c.id === 'pain-reported');
  if (!caution) return null;
  return /^[^.]*\./.exec(caution.text)?.[0] ?? caution.text;
}

function Header({
  detail,
  result,
  name,
  canEdit,
  from,
  toCare,
}: {
  detail: AssessmentDetail;
  result: ResultView;
  name: string;
  canEdit: boolean;
  from?: 'reviews';
  toCare: boolean;
}) {
  const pain = painLine(result);
  return (
    <View style={styles.head}>
      <BackLink detail={detail} from={from} />
      <Text variant="small">Result · {formatDate(detail.screenedOn)}</Text>
      <Text variant="title" accessibilityRole="header">
        {name}
      </Text>
      <AthleteClearanceBadge athleteId={detail.athlete.id} />
      {/* The athlete's earlier screens, charts and comparison: one tap from any of their results. */}
      <Link href={`/athletes/${detail.athlete.id}`} style={styles.back} testID="to-athlete-history">
        <Text variant="label" style={styles.backText}>{`${detail.athlete.firstName}'s history and earlier screens →`}</Text>
      </Link>
      <Text variant="small">
        {result.reason ? 'Worked out again' : 'Submitted'} {formatDate(result.createdAt)}
        {result.createdByName ? ` by ${result.createdByName}` : ''} · version {result.version} · engine {result.engineVersion}
      </Text>
      {canEdit ? (
        <Link href={`/screening/assessments/${detail.id}`} style={styles.action} testID="edit-assessment">
          <Text style={styles.actionText}>Edit the screen and submit again</Text>
        </Link>
      ) : null}
      {pain ? (
        <Notice tone="caution" title="Pain reported" testID="result-pain">
          {result.result.plan.status === 'clearance-needed'
            ? `${pain} No loaded strength or landing work until a physiotherapist clears the athlete.`
            : `${pain} The physiotherapist's decision in force is shown beside the name, above.`}
        </Notice>
      ) : null}
      {toCare ? (
        <Button tone="quiet" label="Go to review, clearance and notes ↓" onPress={() => scrollToId(CARE_ANCHOR, true)} testID="to-care" style={styles.toCare} />
      ) : null}
      <Notice>These results describe how the athlete moved on the day. They are not a diagnosis.</Notice>
    </View>
  );
}

/**
 * What the flags could not look at yet, said under their count (our choice: a result with its photos still
 * unmeasured read as final): no photo consent, or photos with no points placed yet.
 */
function anglesNote(detail: AssessmentDetail): string | null {
  if (!detail.athlete.photoConsent) return 'No photo consent: no angle was measured; these flags come from what the tester ticked.';
  const newest = new Map<string, PhotoView>();
  for (const p of detail.photos) {
    const key = `${p.taskId}:${p.view}`;
    const known = newest.get(key);
    if (!known || known.createdAt < p.createdAt) newest.set(key, p);
  }
  const unmeasured = [...newest.values()].filter(
    (p) => Object.values(detail.draft.tasks[p.taskId as TaskId]?.landmarks?.[p.view] ?? {}).filter(Boolean).length === 0,
  ).length;
  return unmeasured > 0
    ? `${unmeasured} ${unmeasured === 1 ? 'photo has' : 'photos have'} no points placed yet: flags from their angles are added once ${unmeasured === 1 ? 'it is' : 'they are'} measured (To measure).`
    : null;
}

function Flags({ flags, note }: { flags: Flag[]; note?: string | null }) {
  const groups = groupFlags(flags);
  const concerns = groups.filter((g) => g.severity === 'concern').length;
  return (
    <View style={styles.flags} testID="flags">
      <Text variant="heading" accessibilityRole="header" aria-level={2}>
        Flags
      </Text>
      <Text variant="small">
        {groups.length === 0
          ? 'No flags: nothing seen or measured crossed a threshold.'
          : `${groups.length} ${groups.length === 1 ? 'flag' : 'flags'}${concerns ? `, ${concerns} of concern` : ''}. “Watch” means keep an eye on it; “Concern” means work on it now. Each flag lists the tasks that showed it.`}
      </Text>
      {note ? (
        <Text variant="small" style={styles.anglesNote} testID="flags-angles-note">
          {note}
        </Text>
      ) : null}
      {groups.map((g) => (
        <FlagCard key={g.key} group={g} />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  anglesNote: { fontFamily: fonts.bold },
  head: { gap: space.xs },
  back: { minHeight: TOUCH_MIN, justifyContent: 'center' },
  backText: { color: colors.pine },
  action: {
    minHeight: TOUCH_MIN,
    paddingHorizontal: space.lg,
    paddingVertical: space.md,
    borderRadius: radius.md,
    borderWidth: 2,
    borderColor: colors.pine,
    alignSelf: 'flex-start',
    marginVertical: space.sm,
  },
  actionText: { fontFamily: fonts.bold, color: colors.pine, fontSize: 17 },
  primary: {
    minHeight: TOUCH_MIN,
    paddingHorizontal: space.lg,
    paddingVertical: space.md,
    borderRadius: radius.md,
    backgroundColor: colors.pine,
    alignSelf: 'flex-start',
  },
  primaryText: { fontFamily: fonts.bold, color: '#fff', fontSize: 17 },
  nav: { alignItems: 'flex-start' },
  primaryRoom: { height: TOUCH_MIN },
  columns: { gap: space.xl },
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  column: { gap: space.xl },
  columnWide: { flex: 1 },
  flags: { gap: space.md },
  history: { gap: space.xs },
  toCare: { alignSelf: 'flex-start' },
});
