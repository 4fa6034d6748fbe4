import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { ResultView } from '@/features/screening/contract';
import type { PlannedExercise } from '@/features/screening/engine';
import { TESTER_MARK } from '@/features/screening/plan-edits';
import { Button } from '@/features/ui/components/button';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space } from '@/features/ui/theme';
import { ExerciseCard } from './exercise-card';
import { PlanEditor } from './plan-editor';

function day(iso: string): string {
  return iso.slice(0, 10);
}

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
export function PlanSection({ assessmentId, result, oneRepMaxKg, canAdjust }: { assessmentId: string; result: ResultView; oneRepMaxKg: number | null | undefined; canAdjust: boolean }) {
  const plan = result.result.plan;
  const adjustment = result.adjustment;
  const [showProposal, setShowProposal] = useState(false);
  const [editing, setEditing] = useState(false);
  const shown = adjustment && !showProposal ? adjustment.exercises : plan.exercises;

  return (
    <View style={styles.wrap} testID="plan">
      <Text variant="heading" accessibilityRole="header">
        Corrective plan
      </Text>
      {plan.status === 'clearance-needed' ? (
        <Notice tone="error" title="Clearance needed first" testID="plan-clearance">
          Pain was reported. Start this plan only after a physiotherapist or doctor has seen the athlete, and follow their advice over this plan.
        </Notice>
      ) : null}
      <View style={styles.source} testID="plan-source">
        {adjustment ? (
          <>
            <Text style={styles.sourceText}>
              {showProposal
                ? `The engine's proposal (engine ${result.engineVersion})`
                : `Adjusted by ${adjustment.createdByName ?? 'a club member'} on ${day(adjustment.createdAt)}`}
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
          basedOn={{ resultVersion: result.version, adjustedAt: adjustment?.createdAt ?? null }}
          proposal={plan.exercises}
          oneRepMaxKg={oneRepMaxKg}
          onClose={() => setEditing(false)}
        />
      ) : (
        <>
          {shown.length === 0 ? <Text>No exercises: nothing was flagged.</Text> : null}
          {shown.map((ex, i) => (
            <ExerciseCard key={ex.id} exercise={ex} index={i} />
          ))}
          {canAdjust ? <Button tone="secondary" label="Adjust the plan" testID="plan-adjust" onPress={() => { setShowProposal(false); setEditing(true); }} /> : null}
        </>
      )}
      <View style={styles.rescreen} testID="plan-rescreen">
        <Text variant="label">Re-screen</Text>
        <Text>
          {plan.rescreenDate
            ? `On or after ${plan.rescreenDate} (in ${plan.rescreenWeeks} weeks).`
            : `In ${plan.rescreenWeeks} weeks.`}
        </Text>
      </View>
      <Notice tone="caution" title="Before you start" testID="plan-cautions">
        <View style={styles.cautions}>
          {plan.cautions.map((c) => (
            <View key={c.id} style={styles.caution}>
              <Text>{c.text}</Text>
              {c.source ? <Text variant="small">Source: {c.source}</Text> : null}
            </View>
          ))}
          <Text variant="small">
            This plan supports the club&apos;s coaching; it does not replace local codes of practice or licensed professionals. If anything hurts, see a physiotherapist or doctor.
          </Text>
        </View>
      </Notice>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  source: { gap: space.xs, padding: space.md, borderRadius: radius.md, backgroundColor: colors.pineSoft },
  sourceText: { fontFamily: fonts.bold, color: colors.pineDark },
  rescreen: { gap: 2, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface },
  cautions: { gap: space.md },
  caution: { gap: 2 },
});
