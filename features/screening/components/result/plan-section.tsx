import { Link } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { CLEARANCE_LABELS } from '@/features/care/choices';
import { holdsWords, splitByBlock, type StrengthBlock } from '@/features/care/strength-block';
import type { ClearanceView } from '@/features/care/types';
import type { PlanAdjustmentView, ResultView } from '@/features/screening/contract';
import type { PlannedExercise } from '@/features/screening/engine';
import { loadingContextOf, STAGE_LIMITS } from '@/features/screening/engine/limits';
import { shortSource } from '@/features/screening/engine/sources';
import { rescreenWords, STAGE_LABELS } from '@/features/screening/labels';
import { todayIso } from '@/features/athletes/age';
import { TESTER_MARK } from '@/features/screening/plan-edits';
import { oneRepMaxWarning } from '@/features/screening/one-rep-max';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { ExerciseCard } from './exercise-card';
import { PlanEditor } from './plan-editor';
import { formatDate } from '@/features/ui/format-date';
import { scrollToId } from '@/features/ui/scroll-to';

/** "Dropped: …; added: …; re-dosed: …" against the engine's proposal. */
function changeSummary(adjusted: PlannedExercise[], proposal: PlannedExercise[]): string {
  const dropped = proposal.filter((p) => !adjusted.some((a) => a.id === p.id)).map((p) => p.name);
  const added = adjusted.filter((a) => !proposal.some((p) => p.id === a.id)).map((a) => a.name);
  const redosed = adjusted.filter((a) => a.adjustments.some((x) => x.startsWith(TESTER_MARK))).map((a) => a.name);
  const parts = [
    dropped.length ? `dropped ${dropped.join(', ')}` : null,
    added.length ? `added ${added.join(', ')}` : null,
    redosed.length ? `changed the dose of ${redosed.join(', ')}` : null,
  ].filter(Boolean);
  return parts.length ? `Compared with the engine's proposal: ${parts.join('; ')}.` : "Same exercises as the engine's proposal.";
}

/** The corrective plan: the tester's adjustment when there is one, beside the engine's proposal. */
const ROLE_WORDS: Record<string, string> = { head_coach: 'head coach', physio: 'physiotherapist' };

/**
 * The physiotherapist's hold on this plan (`GET /api/assessments/:id/care`): 'pending' while it is read,
 * 'unknown' when it could not be read (loaded strength and landing work are then shown as on hold: the safe side).
 */
export type PlanHold = { block: StrengthBlock; clearance: ClearanceView } | 'pending' | 'unknown';

type Props = {
  assessmentId: string;
  result: ResultView;
  oneRepMaxKg: number | null | undefined;
  /** A 1RM typed at the screen that the check against body mass questioned and nobody confirmed: not used. */
  questionedOneRepMaxKg?: number | null;
  /** The body mass measured at the screen, to question a 1RM far above it. */
  massKg?: number | null;
  canAdjust: boolean;
  /** A head coach or physiotherapist: may go past a limit with a reason. */
  canOverride: boolean;
  hold: PlanHold;
  /** Where a 1RM is entered (the screen's first step), for those who may edit the screen. */
  oneRepMaxHref?: string;
};

const PLAN_TOP = 'plan-top';

const UNKNOWN_HOLD: StrengthBlock = {
  blocked: true,
  reason: 'clearance-needed',
  holds: ['loaded', 'landing'],
  words: "The physiotherapist's clearance could not be read: loaded strength and landing work are shown as on hold until it can.",
};

export function PlanSection({ assessmentId, result, oneRepMaxKg, questionedOneRepMaxKg, massKg, canAdjust, canOverride, hold, oneRepMaxHref }: Props) {
  const plan = result.result.plan;
  const adjustment = result.adjustment;
  const loading = loadingContextOf(result.result, oneRepMaxKg);
  const withheld = plan.withheld ?? [];
  const history = result.adjustmentHistory ?? (adjustment ? [adjustment] : []);
  const [showProposal, setShowProposal] = useState(false);
  const [editing, setEditing] = useState(false);
  const shown = adjustment && !showProposal ? adjustment.exercises : plan.exercises;
  const block: StrengthBlock = hold === 'unknown' ? UNKNOWN_HOLD : hold === 'pending' ? { blocked: false } : hold.block;
  const clearance = typeof hold === 'object' ? hold.clearance : null;
  // Loaded strength and landing work held back by "refer on" or "clearance needed" is set apart below the plan.
  const { now, held } = splitByBlock(shown, block);

  return (
    <View style={styles.wrap} testID="plan" nativeID={PLAN_TOP}>
      <Text variant="heading" accessibilityRole="header" aria-level={2}>
        Corrective plan
      </Text>
      {plan.status === 'clearance-needed' ? (
        <Notice tone="error" title="Clearance needed first" testID="plan-clearance">
          <Text>
            Pain was reported. No loaded strength work and no landing work until a physiotherapist has cleared the athlete. Follow their advice over this plan.
          </Text>
          <Text>
            {plan.exercises.length > 0
              ? `Meanwhile the athlete may still do, only where pain-free: ${plan.exercises.map((e) => e.name).join(', ')}.`
              : 'Meanwhile: no exercises from this plan.'}
          </Text>
          {withheld.length > 0 ? <Text variant="small">Held back until then: {withheld.map((w) => w.name).join(', ')}.</Text> : null}
        </Notice>
      ) : null}
      {result.reason ? (
        <Notice title={`Version ${result.version}: worked out again after a physiotherapist’s decision`} testID="plan-cleared">
          {result.reason}
        </Notice>
      ) : null}
      {!adjustment && result.earlierAdjustment ? (
        <Notice tone="caution" title="Earlier adjustment not carried over" testID="plan-earlier-adjustment">
          {`${result.earlierAdjustment.createdByName ?? 'A club member'} adjusted the plan of version ${result.earlierAdjustment.version} on ${formatDate(result.earlierAdjustment.createdAt)}. Version ${result.version} ${result.reason ? 'was worked out again after a physiotherapist’s decision' : 'came from a new submission'} and starts again from the engine's proposal below: adjust it again if those changes still apply.`}
        </Notice>
      ) : null}
      {clearance ? (
        <Text variant="small" testID="plan-clearance-state">
          Clearance in force: {CLEARANCE_LABELS[clearance.status]}, set by {clearance.setByName ?? 'a former member'} on {formatDate(clearance.setAt)}
          {clearance.detail ? ` (“${clearance.detail}”)` : ''}.
        </Text>
      ) : null}
      <Notice
        tone={loading.stage === 'unknown' || loading.stage === 'near' ? 'caution' : 'info'}
        title={`${STAGE_LABELS[loading.stage]}: loading limits`}
        testID="plan-stage"
      >
        {loading.stage === 'unknown'
          ? `No growth estimate (${loading.unknownReason === 'age-outside-range' ? 'age outside the range of the maturity equations' : loading.unknownReason === 'measures-missing' ? 'body measures missing' : 'not estimated'}): the plan applies the cautious limits of the growth-spurt window, at most ${STAGE_LIMITS.unknown.maxPercentOneRepMax}% of 1RM, no sets to fatigue, landing volume halved.`
          : `${loading.stage === 'near' ? 'Within the growth estimate’s error of the window, so its limits apply: at most' : 'At most'} ${STAGE_LIMITS[loading.stage].maxPercentOneRepMax}% of 1RM${STAGE_LIMITS[loading.stage].toNearFatigue ? '' : ', no sets to fatigue'}${STAGE_LIMITS[loading.stage].jumpVolumeFactor < 1 ? ', landing volume halved' : ''}. The plan editor checks changes against the same limits: only a physiotherapist or head coach can go past one, with a written reason.`}
      </Notice>
      <Text variant="small" testID="plan-one-rep-max">
        {oneRepMaxKg != null
          ? `Split-squat 1RM on record: ${oneRepMaxKg} kg. Loads below are shares of it.`
          : questionedOneRepMaxKg != null
            ? `A split-squat 1RM of ${questionedOneRepMaxKg} kg was typed but not confirmed after the check against body mass: loaded exercises use bodyweight until it is confirmed.`
            : 'No split-squat 1RM on record: loaded exercises use bodyweight until one is estimated.'}
      </Text>
      {oneRepMaxKg == null && oneRepMaxHref ? (
        <Link href={oneRepMaxHref as never} style={styles.oneRepMaxLink} testID="plan-one-rep-max-enter">
          <Text variant="label" style={styles.linkText}>
            {questionedOneRepMaxKg != null
              ? 'Check and confirm the 1RM (the screen’s first step) →'
              : 'Enter an estimated 1RM (the screen’s first step; loads then follow from it) →'}
          </Text>
        </Link>
      ) : null}
      {oneRepMaxWarning(oneRepMaxKg ?? questionedOneRepMaxKg, massKg) ? (
        <Notice tone="caution" title="Check the 1RM" testID="plan-one-rep-max-warning">
          {oneRepMaxWarning(oneRepMaxKg ?? questionedOneRepMaxKg, massKg)}
        </Notice>
      ) : null}
      {adjustment && !showProposal && adjustment.overrides?.length ? <Overrides adjustment={adjustment} /> : null}
      <View style={styles.source} testID="plan-source">
        {adjustment ? (
          <>
            <Text style={styles.sourceText}>
              {showProposal
                ? `The engine's proposal (engine ${result.engineVersion})`
                : `Adjusted by ${adjustment.createdByName ?? 'a club member'} on ${formatDate(adjustment.createdAt)}`}
            </Text>
            {!showProposal ? <Text variant="small">{changeSummary(adjustment.exercises, plan.exercises)}</Text> : null}
            {adjustment.note && !showProposal ? <Text variant="small">“{adjustment.note}”</Text> : null}
            <Button
              tone="quiet"
              label={showProposal ? 'Show the adjusted plan' : "Show the engine's proposal"}
              testID="plan-toggle"
              onPress={() => setShowProposal((s) => !s)}
            />
          </>
        ) : (
          <Text style={styles.sourceText}>Proposed by the screening engine ({result.engineVersion})</Text>
        )}
      </View>
      {editing ? (
        <PlanEditor
          assessmentId={assessmentId}
          start={adjustment?.exercises ?? plan.exercises}
          startNote={adjustment?.note ?? ''}
          startOverrides={adjustment?.overrides ?? []}
          basedOn={{ resultVersion: result.version, adjustedAt: adjustment?.createdAt ?? null }}
          proposal={plan.exercises}
          loading={loading}
          canOverride={canOverride}
          onClose={() => setEditing(false)}
        />
      ) : (
        <>
          {hold === 'pending' ? (
            <Text testID="plan-hold-pending">Checking the physiotherapist&apos;s clearance…</Text>
          ) : (
            <>
              {shown.length === 0 ? <Text>No exercises: nothing was flagged.</Text> : null}
              {now.map((ex, i) => (
                <ExerciseCard key={ex.id} exercise={ex} index={i} />
              ))}
              <HeldWork block={block} clearance={clearance} held={held} withheld={withheld} />
            </>
          )}
          {canAdjust ? (
            <Button
              tone="secondary"
              label="Adjust the plan"
              testID="plan-adjust"
              onPress={() => {
                setShowProposal(false);
                setEditing(true);
                // The button sits under the list; the editor opens in its place: its first exercise, not
                // its last buttons, should meet the eye.
                setTimeout(() => scrollToId(PLAN_TOP), 0);
              }}
            />
          ) : null}
        </>
      )}
      {history.length > 0 ? (
        <View style={styles.rescreen} testID="plan-history">
          <Text variant="label">Plan history</Text>
          {history.map((h, i) => (
            <Text key={`${h.createdAt}-${i}`} variant="small">
              {formatDate(h.createdAt)} · {h.createdByName ?? 'a club member'}
              {i === 0 ? ' (current)' : ''}: {h.exercises.length} exercises
              {h.overrides?.length ? `, ${h.overrides.length} ${h.overrides.length === 1 ? 'limit' : 'limits'} passed on purpose` : ''}
              {h.note ? `. “${h.note}”` : ''}
            </Text>
          ))}
          <Text variant="small">The engine&apos;s proposal is kept unchanged beside every adjustment.</Text>
        </View>
      ) : null}
      <View style={styles.rescreen} testID="plan-rescreen">
        <Text variant="label">Re-screen</Text>
        <Text>{rescreenWords(plan.rescreenDate, plan.rescreenWeeks, todayIso())}</Text>
      </View>
      <Notice tone="caution" title="Before you start" testID="plan-cautions">
        <View style={styles.cautions}>
          {plan.cautions.map((c) => (
            <View key={c.id} style={styles.caution}>
              <Text>{c.text}</Text>
              {c.source ? <Text variant="small">Source: {shortSource(c.source)}</Text> : null}
            </View>
          ))}
          <Text variant="small">
            This plan supports the club&apos;s coaching; it does not replace local codes of practice or licensed professionals. If anything hurts, see a
            physiotherapist or doctor.
          </Text>
        </View>
      </Notice>
    </View>
  );
}

/**
 * Work that must not be done yet, set apart from the plan with the reason: "refer on" or "clearance
 * needed" (the care team's hold on loaded strength and landing work), and what the engine held back because pain was
 * reported at the screen.
 */
function HeldWork({
  block,
  clearance,
  held,
  withheld,
}: {
  block: StrengthBlock;
  clearance: ClearanceView;
  held: PlannedExercise[];
  withheld: { id: string; name: string; reason: string }[];
}) {
  if (held.length === 0 && withheld.length === 0 && !block.blocked) return null;
  const who = `${clearance?.setByName ?? 'a physiotherapist'}`;
  const when = clearance ? formatDate(clearance.setAt) : 'a recent date';
  const reason = !block.blocked
    ? null
    : block.reason === 'referred'
      ? `Refer on: ${who} referred the athlete on ${when}${clearance?.detail ? ` (${clearance.detail})` : ''}. Loaded strength work and landing work wait until a physiotherapist clears the athlete.`
      : block.reason === 'changes'
        ? `Train with changes, set by ${who} on ${when}. ${block.words}${clearance?.detail ? ` Their words: “${clearance.detail}”` : ''}`
        : `Clearance needed: ${block.words}`;
  return (
    <View style={styles.held} testID="plan-held">
      <Text variant="heading" style={styles.heldTitle}>
        On hold: not to be done yet
      </Text>
      {reason ? (
        <Text testID="plan-held-reason" style={styles.heldReason}>
          {reason}
        </Text>
      ) : null}
      {held.map((ex, i) => (
        <View key={ex.id} style={styles.heldCard} testID="plan-held-exercise">
          <ExerciseCard exercise={ex} index={i} onHold />
        </View>
      ))}
      {block.blocked && held.length === 0 && withheld.length === 0 ? (
        <Text variant="small">
          {block.holds.length > 1
            ? 'Nothing in this plan is loaded strength or landing work.'
            : `Nothing in this plan is ${holdsWords(block.holds).toLowerCase()}.`}
        </Text>
      ) : null}
      {withheld.length > 0 ? (
        <View style={styles.withheld} testID="plan-withheld">
          <Text variant="label">Pain reported at this screen: held back by the engine</Text>
          {withheld.map((w) => (
            <Text key={w.id} variant="small">
              • {w.name}: {w.reason.replace(/^Held back: /, '')}
            </Text>
          ))}
        </View>
      ) : null}
    </View>
  );
}

/** The limits a head coach or physiotherapist passed on purpose, each with its reason: a caution on the plan. */
function Overrides({ adjustment }: { adjustment: PlanAdjustmentView }) {
  return (
    <Notice tone="caution" title="Caution: limits passed on purpose" testID="plan-overrides">
      {adjustment.overrides.map((o) => (
        <View key={`${o.exerciseId}-${o.limit}`} style={styles.caution}>
          <Text>{o.message}</Text>
          <Text variant="small">
            Reason given by {adjustment.createdByName ?? 'a club member'} ({ROLE_WORDS[o.role] ?? o.role}): “{o.reason}”
          </Text>
        </View>
      ))}
    </Notice>
  );
}

const styles = StyleSheet.create({
  oneRepMaxLink: { minHeight: TOUCH_MIN, paddingVertical: space.sm },
  linkText: { color: colors.pine },
  wrap: { gap: space.md },
  source: { gap: space.xs, padding: space.md, borderRadius: radius.md, backgroundColor: colors.pineSoft },
  sourceText: { fontFamily: fonts.bold, color: colors.pineDark },
  rescreen: { gap: 2, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface },
  cautions: { gap: space.md },
  held: {
    gap: space.sm,
    padding: space.md,
    borderRadius: radius.md,
    borderWidth: 2,
    borderColor: colors.brick,
    borderStyle: 'dashed',
    backgroundColor: colors.brickSoft,
  },
  heldTitle: { color: colors.brick },
  heldReason: { fontFamily: fonts.bold },
  heldCard: { opacity: 0.75 },
  withheld: { gap: 2 },
  caution: { gap: 2 },
});
