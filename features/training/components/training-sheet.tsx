import { Link, useRouter } from 'expo-router';
import { useEffect, useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { can } from '@/features/access/permissions';
import { biggestSquadId, useSquadsQuery } from '@/features/athletes/api/get-squads';
import { useActiveClub } from '@/features/session/active-club';
import { PHASE_WORDS } from '@/features/screening/labels';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Chips } from '@/features/ui/components/chips';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { formatDate } from '@/features/ui/format-date';
import { canPrint, printPage, PRINT_COLUMNS, PRINT_HIDE, PRINT_KEEP, PRINT_ROOT, usePrintStyles } from '@/features/ui/print';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { useTrainingSheetQuery } from '../api/get-training-sheet';
import { SessionsCard, withoutConsent } from './record-session';
import { doseGroups, sharedDetail } from '../lines';
import type { SheetAthlete, SheetExercise, TrainingSheet } from '../sheet';

const NOT_KEPT = 'No connection. Open a squad’s sheet once with a connection to keep it on this phone.';

/**
 * A squad's corrective plans on one sheet for a group session: one card per exercise with the athletes
 * doing it and their dose and load, the holds first, then whoever is not on the sheet and why. Printable.
 */
export function TrainingSheetScreen({ initialSquadId }: { initialSquadId?: string }) {
  usePrintStyles();
  const router = useRouter();
  const squads = useSquadsQuery();
  const [squadId, setSquadId] = useState<string | null>(initialSquadId ?? null);
  useEffect(() => {
    if (!squadId && squads.data) setSquadId(biggestSquadId(squads.data.squads));
  }, [squadId, squads.data]);
  const sheet = useTrainingSheetQuery(squadId);

  // Without a connection the squads cannot be listed (the query fails, or waits for the network), but a
  // sheet kept on this phone still opens.
  const offline = !!squads.error || squads.isPaused;
  if (offline && !sheet.data) {
    if (squadId && sheet.isFetching) return <Text>Loading the plans…</Text>;
    return <Notice tone="error">{sheet.error?.message ?? squads.error?.message ?? NOT_KEPT}</Notice>;
  }
  // Only before anything is shown: once a sheet is on screen (kept on the phone, with the squads still to
  // load when the connection comes back), the page stays, so an open record form keeps its ticks.
  if (squads.isPending && !offline && !sheet.data) return <Text>Loading squads…</Text>;
  if (squads.data?.squads.length === 0) return <Notice>No squad yet: add one under Athletes.</Notice>;

  return (
    <View style={styles.wrap} {...PRINT_ROOT} testID="training-sheet">
      <Text variant="title" accessibilityRole="header">
        Training sheet{sheet.data ? `: ${sheet.data.squad.name}` : ''}
      </Text>
      {offline ? (
        <Notice title="No connection" testID="sheet-offline">
          This is the sheet as this phone last loaded it. Squads can be switched once the connection is back.
        </Notice>
      ) : null}
      {squads.data ? (
        <View {...PRINT_HIDE}>
          <Chips
            label="Squad"
            options={squads.data.squads.map((s) => ({ value: s.id, label: s.name }))}
            value={squadId ?? ''}
            onChange={(v) => {
              setSquadId(v);
              // In the address too, so a sheet kept open on the gym's tablet comes back to the same squad.
              router.setParams({ squad: v });
            }}
            testID="sheet-squad"
          />
        </View>
      ) : null}
      {sheet.error ? <Notice tone="error">{sheet.error.message}</Notice> : null}
      {sheet.isPending ? <Text>Loading the plans…</Text> : null}
      {sheet.data ? <SheetBody key={sheet.data.squad.id} data={sheet.data} /> : null}
    </View>
  );
}

function SheetBody({ data }: { data: TrainingSheet }) {
  const { membership } = useActiveClub();
  const { isWide, isTabletUp } = useBreakpoints();
  const resultOf = useMemo(() => new Map(data.athletes.map((a) => [a.id, a])), [data.athletes]);
  const withPlan = data.athletes.filter((a) => a.state === 'plan').length;
  const held = data.athletes.filter((a) => a.hold);
  const changed = data.athletes.filter((a) => a.physioChanges);
  const growing = data.athletes.filter((a) => a.state === 'plan' && a.growthSpurt);
  const off = data.athletes.filter((a) => a.state !== 'plan');
  // Everyone whose re-screen date has come (the next round shows whether the plan worked), and those
  // never screened, said apart.
  const due = data.athletes.filter((a) => a.state !== 'no-screen' && a.rescreenDue);
  const neverScreened = data.athletes.filter((a) => a.state === 'no-screen');
  // Said at the top too (the "not on the sheet" card comes after every exercise): on no exercise today.
  const noConsent = data.athletes.filter(withoutConsent);
  // At the top beside the count on a wide screen; at the end on a phone, where the plans come first.
  const printButton = canPrint ? (
    <View {...PRINT_HIDE} style={styles.actions}>
      <Button tone="secondary" label="Print the sheet" onPress={printPage} testID="sheet-print" />
    </View>
  ) : null;

  return (
    <View style={styles.body}>
      <View style={[styles.top, isTabletUp && styles.topWide]}>
        <Text variant="small" testID="sheet-count">
          {`${withPlan} of ${data.athletes.length} ${data.athletes.length === 1 ? 'athlete has' : 'athletes have'} a plan · as of ${formatDate(data.today)}`}
        </Text>
        {isTabletUp ? printButton : null}
      </View>
      {due.length || neverScreened.length || noConsent.length ? (
        <Text variant="small" testID="sheet-due">
          {[
            due.length ? `Due a re-screen: ${due.map((a) => a.name).join(', ')}.` : '',
            neverScreened.length ? `Not screened yet: ${neverScreened.map((a) => a.name).join(', ')}.` : '',
            noConsent.length
              ? `No corrective exercises without the family's agreement: ${noConsent.map((a) => `${a.name} (${a.state === 'consent-refused' ? 'said no' : 'not recorded yet'})`).join(', ')}.`
              : '',
          ]
            .filter(Boolean)
            .join(' ')}
        </Text>
      ) : null}
      <Notice tone="caution" title="Before the session">
        Plans as they stand after each athlete’s newest screen. Warm up first; stop anything that hurts and tell a coach. Not a diagnosis.
      </Notice>
      {growing.length ? (
        <Text variant="small" testID="sheet-growth-spurt">
          {`In the growth-spurt window: ${growing.map((a) => a.name).join(', ')}. Their plans already cap loads, leave out sets to fatigue and halve landing volume. Pain at the front of the knee, below the kneecap or at the heel: stop and refer.`}
        </Text>
      ) : null}
      {held.length ? (
        <Notice tone="caution" title={`Work on hold: ${held.length}`} testID="sheet-holds">
          {held.map((a) => (
            <Text key={a.id}>
              <Text style={styles.strong}>{a.name}</Text>: {a.hold}
            </Text>
          ))}
        </Notice>
      ) : null}
      {changed.length ? (
        <Notice tone="caution" title={`Training with a physiotherapist's changes: ${changed.length}`} testID="sheet-physio-changes">
          {changed.map((a) => (
            <Text key={a.id}>
              <Text style={styles.strong}>{a.name}</Text>: {a.physioChanges}
            </Text>
          ))}
          <Text>Work the physiotherapist held back is set apart below; check the rest of their exercises against these words before the session.</Text>
        </Notice>
      ) : null}
      <View {...PRINT_HIDE}>
        <SessionsCard sheet={data} canRecord={can(membership.role, 'training.record')} />
      </View>
      {data.exercises.length === 0 ? <Notice>Nobody in this squad has an exercise to do yet.</Notice> : null}
      <View style={[styles.grid, isTabletUp && styles.gridTwo]} {...PRINT_COLUMNS}>
        {data.exercises.map((e) => (
          <View key={e.id} style={[styles.cell, isTabletUp && styles.cellTwo, isWide && styles.cellThree]} {...PRINT_KEEP}>
            <ExerciseCard exercise={e} resultOf={resultOf} />
          </View>
        ))}
      </View>
      {off.length ? <NotOnSheet athletes={off} /> : null}
      {isTabletUp ? null : printButton}
    </View>
  );
}

function resultHref(a: SheetAthlete | undefined): string | null {
  return a?.assessmentId ? `/screening/assessments/${a.assessmentId}/result` : null;
}

function ExerciseCard({ exercise, resultOf }: { exercise: SheetExercise; resultOf: Map<string, SheetAthlete> }) {
  const shared = sharedDetail(exercise.entries.filter((e) => !e.held));
  const n = exercise.entries.length;
  return (
    <Card style={styles.card} testID={`sheet-exercise-${exercise.id}`}>
      <Text variant="small">{`${PHASE_WORDS[exercise.phase]} · ${n} ${n === 1 ? 'athlete' : 'athletes'}`}</Text>
      <Text variant="heading" accessibilityRole="header" aria-level={2}>
        {exercise.name}
      </Text>
      <Text variant="small">{`Cue: ${exercise.cue}`}</Text>
      {shared ? <Text variant="small">{shared}</Text> : null}
      {doseGroups(exercise.entries).map((g, i) => (
        <View key={i} style={styles.group} testID={`sheet-group-${exercise.id}`}>
          {g.held ? (
            <Text style={styles.held}>On hold: not today</Text>
          ) : (
            <>
              <Text variant="label">{g.dose}</Text>
              <Text variant="small">{g.load}</Text>
              {shared ? null : <Text variant="small">{g.detail}</Text>}
              {g.adjustments.map((a) => (
                <Text key={a} variant="small" style={styles.adjustment}>
                  {a}
                </Text>
              ))}
            </>
          )}
          <View accessibilityRole="list" style={styles.names}>
            {g.entries.map((x) => (
              <View
                key={x.athleteId}
                accessibilityRole={'listitem' as never}
                testID={`sheet-entry-${exercise.id}-${x.athleteId}`}
                style={x.physioChanges && !g.held ? styles.entryWide : undefined}
              >
                <AthleteName name={x.name} href={resultHref(resultOf.get(x.athleteId))} />
                {/* A mark under the name at every exercise, the physiotherapist's words once at the top: work
                    they hold back is set apart by the holds, and their words (which may be clinical) were
                    repeated at each exercise of a sheet that is printed courtside (our choice). */}
                {x.physioChanges && !g.held ? (
                  <Text variant="small" style={styles.physio} testID="sheet-physio-line">
                    {"⚠ Physio's changes: check the top of the sheet before this exercise"}
                  </Text>
                ) : null}
              </View>
            ))}
          </View>
        </View>
      ))}
    </Card>
  );
}

/** An athlete's name: a link to their newest result (the full plan, with how to do each exercise). */
function AthleteName({ name, href }: { name: string; href: string | null }) {
  return href ? (
    <Link href={href} style={styles.name}>
      {name}
    </Link>
  ) : (
    <Text style={styles.strong}>{name}</Text>
  );
}

const OFF_WORDS: Record<Exclude<SheetAthlete['state'], 'plan'>, string> = {
  'consent-refused': 'The family said no to screening and corrective exercises: none for them',
  'consent-missing': 'No decision from the family about screening and corrective exercises is recorded yet: none until it is',
  'no-screen': 'Not screened yet',
  'no-exercises': 'No corrective exercise from their newest screen',
};

function NotOnSheet({ athletes }: { athletes: SheetAthlete[] }) {
  return (
    <Card style={styles.card} testID="sheet-off">
      <Text variant="heading" accessibilityRole="header" aria-level={2}>
        Not on the sheet
      </Text>
      {athletes.map((a) => {
        const href = resultHref(a);
        const words = a.state === 'plan' ? '' : OFF_WORDS[a.state];
        return (
          <View key={a.id} style={styles.entry}>
            <AthleteName name={a.name} href={href} />
            <Text variant="small">{a.rescreenDue ? `${words}. A screen is due.` : `${words}.`}</Text>
          </View>
        );
      })}
    </Card>
  );
}

const styles = StyleSheet.create({
  physio: { color: colors.ink, fontFamily: fonts.bold },
  wrap: { gap: space.lg },
  body: { gap: space.lg },
  actions: { flexDirection: 'row' },
  top: { gap: space.sm },
  topWide: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between' },
  grid: { gap: space.md },
  gridTwo: { flexDirection: 'row', flexWrap: 'wrap' },
  cell: { width: '100%' },
  cellTwo: { width: '48%', flexGrow: 1 },
  cellThree: { width: '32%' },
  card: { gap: space.xs },
  entry: { borderTopWidth: 1, borderTopColor: colors.line, paddingBottom: space.sm, gap: 2 },
  group: { borderTopWidth: 1, borderTopColor: colors.line, marginTop: space.sm, paddingTop: space.sm, gap: 2 },
  names: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg },
  // A name with the physiotherapist's words takes a line of its own, the words wrapping under it.
  entryWide: { flexBasis: '100%' },
  // 24 px of line and 12 above and below: a 48 px target for a thumb.
  name: { fontFamily: fonts.bold, fontSize: 17, lineHeight: 24, paddingVertical: (TOUCH_MIN - 24) / 2, color: colors.pine, textDecorationLine: 'underline' },
  strong: { fontFamily: fonts.bold },
  held: {
    fontFamily: fonts.bold,
    color: colors.amber,
    backgroundColor: colors.amberSoft,
    alignSelf: 'flex-start',
    paddingHorizontal: space.sm,
    borderRadius: radius.sm,
  },
  adjustment: { color: colors.amber },
});
