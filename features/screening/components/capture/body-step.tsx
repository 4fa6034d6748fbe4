import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { ValidationError } from 'yup';
import { BODY_LIMITS, bodySchema, saveDraftSchema, type AssessmentDraft } from '@/features/screening/contract';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { colors, space, TOUCH_MIN } from '@/features/ui/theme';
import { NumberField } from './number-field';
import { TickBox } from '../tick-box';
import { MEASURE_FIRST } from './before-each-athlete';
import { oneRepMaxWarning } from '@/features/screening/one-rep-max';

type BodyKey = 'statureCm' | 'sittingHeightCm' | 'massKg';

function check(fn: () => void): string | null {
  try {
    fn();
    return null;
  } catch (e) {
    return e instanceof ValidationError ? e.message : 'Check this value.';
  }
}

/** Standing height, sitting height and body mass, checked with the contract's bodySchema as they are typed. */
export function BodyStep({
  draft,
  update,
  firstName,
  athleteId,
}: {
  draft: AssessmentDraft;
  update(change: (d: AssessmentDraft) => AssessmentDraft): void;
  firstName: string;
  athleteId: string;
}) {
  const { isTabletUp } = useBreakpoints();
  const body = draft.body ?? {};
  const field = (key: BodyKey, label: string, hint: string, testID: string) => (
    <NumberField
      label={label}
      hint={hint}
      testID={testID}
      value={body[key]}
      validate={(n) => check(() => bodySchema.validateSyncAt(key, { ...body, [key]: n }))}
      onCommit={(n) => update((d) => ({ ...d, body: { ...d.body, [key]: n } }))}
    />
  );
  return (
    <View style={styles.wrap}>
      {/* Asked first, before anything is measured or run: a child in pain is not screened today. */}
      <Card>
        <TickBox
          label="Something hurts today"
          hint={`Ask ${firstName} before anything else. Tick only if they say something hurts.`}
          checked={draft.hurtsToday === true}
          onChange={(on) => update((d) => ({ ...d, hurtsToday: on ? true : null }))}
          testID="body-hurts-today"
        />
        {draft.hurtsToday === true ? (
          <Notice tone="error" title={`Do not screen ${firstName} today`} testID="body-hurts-stop">
            <View style={styles.check}>
              <Text>{`Stop here: nothing is measured or run while something hurts. Tell the head coach and the family; a physiotherapist or doctor should see ${firstName} before the next screen.`}</Text>
              <Link href={`/athletes/${athleteId}`} style={styles.link} testID="body-hurts-note">
                <Text variant="label" style={styles.linkText}>{`Write what hurts in a note on ${firstName}'s page →`}</Text>
              </Link>
            </View>
          </Notice>
        ) : null}
      </Card>
      <Notice title="Before you measure" testID="measure-first">
        {MEASURE_FIRST.map((line) => (
          <Text key={line}>• {line}</Text>
        ))}
      </Notice>
      <Card style={isTabletUp ? styles.grid : undefined}>
        <View style={isTabletUp ? styles.cell : undefined}>
          {field('statureCm', 'Standing height (cm)', `Between ${BODY_LIMITS.statureCm[0]} and ${BODY_LIMITS.statureCm[1]} cm.`, 'body-stature')}
        </View>
        <View style={isTabletUp ? styles.cell : undefined}>
          {field('sittingHeightCm', 'Sitting height (cm)', 'Seat to the top of the head.', 'body-sitting')}
        </View>
        <View style={isTabletUp ? styles.cell : undefined}>
          {field('massKg', 'Body mass (kg)', `Between ${BODY_LIMITS.massKg[0]} and ${BODY_LIMITS.massKg[1]} kg.`, 'body-mass')}
        </View>
      </Card>
      <Card>
        <Text variant="label">Split-squat 1RM, if known</Text>
        <NumberField
          label="1RM (kg)"
          hint="Only from a submaximal test under qualified supervision. Leave empty if unknown: the plan then uses bodyweight."
          testID="body-one-rep-max"
          value={draft.oneRepMaxKg}
          validate={(n) => {
            const message = check(() => saveDraftSchema.validateSyncAt('draft.oneRepMaxKg', { draftVersion: 0, draft: { oneRepMaxKg: n } }));
            return message ? `${message} Leave it empty if it is not known.` : null;
          }}
          onCommit={(n) => update((d) => ({ ...d, oneRepMaxKg: n }))}
        />
        {oneRepMaxWarning(draft.oneRepMaxKg, body.massKg) ? (
          <Notice tone="caution" title="Check the 1RM" testID="one-rep-max-warning">
            <View style={styles.check}>
              <Text>{oneRepMaxWarning(draft.oneRepMaxKg, body.massKg)}</Text>
              <TickBox
                label={`I checked it: work loads out from ${draft.oneRepMaxKg} kg`}
                hint={
                  draft.oneRepMaxCheckedKg != null && draft.oneRepMaxCheckedKg === draft.oneRepMaxKg
                    ? `Ticked: loads are worked out from ${draft.oneRepMaxKg} kg once the screen is submitted.`
                    : 'Until this is ticked the plan uses bodyweight, as with no 1RM.'
                }
                checked={draft.oneRepMaxCheckedKg != null && draft.oneRepMaxCheckedKg === draft.oneRepMaxKg}
                onChange={(on) => update((d) => ({ ...d, oneRepMaxCheckedKg: on ? (d.oneRepMaxKg ?? null) : null }))}
                testID="one-rep-max-confirm"
              />
            </View>
          </Notice>
        ) : null}
      </Card>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  cell: { flexBasis: 220, flexGrow: 1 },
  check: { gap: space.sm },
  link: { minHeight: TOUCH_MIN, paddingVertical: space.sm },
  linkText: { color: colors.pine },
});
