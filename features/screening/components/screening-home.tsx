import { plural } from '@/features/ui/plural';
import { can } from '@/features/access/permissions';
import { Link, useLocalSearchParams } from 'expo-router';
import { useDeferredValue, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { isOpenRound, useClubRoundsQuery, type SquadWithRounds } from '@/features/screening/api/get-rounds';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { PAGE_HEADS } from '@/features/shell/page-heads';
import { Text } from '@/features/ui/components/text';
import { colors, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { OpenRoundForm } from './open-round-form';
import { RoundsUnavailable } from './kept-rounds';
import { RoundProgress } from './round-progress';
import { PlainTag } from './status-tag';
import { formatDate } from '@/features/ui/format-date';

/** The club's squads with their screening rounds, and the form to open a new round. */
export function ScreeningHome() {
  const { membership } = useActiveClub();
  // `/screening?squad=<id>` (the homes' "All open rounds" link) shows that squad first, its whole list open.
  const { squad: expandSquad } = useLocalSearchParams<{ squad?: string }>();
  const { isWide } = useBreakpoints();
  const { squads, rounds: roundsQuery, bySquad: liveBySquad, error } = useClubRoundsQuery();
  // Drawn in the background when the lists arrive, as on the homes (OpenRounds): drawn at once, the
  // cards of every squad's rounds made one long task while the page started.
  const bySquad = useDeferredValue(liveBySquad);
  const listPending = useDeferredValue(squads.isPending || roundsQuery.isPending);
  const canOpen = can(membership.role, 'screening.write');
  // On a phone the form waits behind one button at the top; a wide screen shows it beside the rounds.
  const [formOpen, setFormOpen] = useState(false);
  const form =
    canOpen && squads.data ? (
      <Card>
        <Text variant="heading" accessibilityRole="header" aria-level={2}>
          Open a round
        </Text>
        <OpenRoundForm squads={squads.data.squads} />
        {!isWide ? <Button tone="quiet" label="Cancel" onPress={() => setFormOpen(false)} /> : null}
      </Card>
    ) : null;

  if (error) return <RoundsUnavailable error={error} withTitle />;
  return (
    <View style={styles.wrap}>
      <View style={styles.head}>
        <Text variant="title" accessibilityRole="header">
          {PAGE_HEADS.screening.title}
        </Text>
        <Text>{PAGE_HEADS.screening.text}</Text>
      </View>
      {/* In place from the first render (usable once the squads are known), and the line below it: the
          button appearing, or the line above it going, moved the page under a thumb about to tap. */}
      {!isWide && canOpen ? (
        formOpen && form ? (
          form
        ) : (
          <Button label="Open a round" testID="open-round-start" disabled={!squads.data} onPress={() => setFormOpen(true)} />
        )
      ) : null}
      {/* The cards come once their rounds are known too: a card that grows as its rounds arrive pushes
          the next one down. */}
      {listPending ? <Text>Loading rounds…</Text> : null}
      <View style={[styles.columns, isWide && styles.columnsWide]}>
        <View style={[styles.main, isWide && styles.mainWide]}>
          {(listPending ? [] : chosenFirst(bySquad, expandSquad)).map(({ squad, rounds }) => (
            <SquadRounds key={squad.id} squad={squad} rounds={rounds} expanded={squad.id === expandSquad} />
          ))}
        </View>
        {isWide && form ? <View style={styles.side}>{form}</View> : null}
      </View>
    </View>
  );
}

/** The squad asked for first, the others in their order. */
function chosenFirst(list: SquadWithRounds[], squadId: string | undefined): SquadWithRounds[] {
  const chosen = list.find((x) => x.squad.id === squadId);
  return chosen ? [chosen, ...list.filter((x) => x !== chosen)] : list;
}

/**
 * The rounds a squad card lists before its "Show … earlier rounds" button: our choice, a season's last
 * few screens and re-tests.
 * A club's rounds pile up over seasons (a round with an absent athlete stays open), and every card
 * listed them all, pushing the next squad far down a phone.
 */
const ROUNDS_SHOWN = 4;

function SquadRounds({ squad, rounds, expanded }: SquadWithRounds & { expanded: boolean }) {
  const [all, setAll] = useState(expanded);
  const shown = all ? rounds : rounds.slice(0, ROUNDS_SHOWN);
  const hidden = rounds.length - ROUNDS_SHOWN;
  const hiddenOpen = rounds.slice(ROUNDS_SHOWN).filter(isOpenRound).length;
  return (
    <Card testID={`squad-rounds-${squad.id}`}>
      <Text variant="heading">{squad.name}</Text>
      <Text variant="small">{plural(squad.athleteCount, 'athlete', 'athletes')}</Text>
      {rounds.length === 0 ? <Text variant="small">No rounds yet.</Text> : null}
      <View>
        {shown.map((r) => (
          <Link key={r.id} href={`/screening/rounds/${r.id}`} style={styles.round} testID={`round-${r.id}`}>
            <View style={styles.roundInner}>
              <View style={styles.roundHead}>
                <Text variant="label" style={styles.roundName}>
                  {r.name}
                </Text>
                {r.closedAt ? <PlainTag label="Closed" /> : isOpenRound(r) ? <PlainTag label="Open" tone="info" /> : <PlainTag label="Complete" tone="info" />}
              </View>
              <Text variant="small">{formatDate(r.screenedOn)}</Text>
              <RoundProgress round={r} />
            </View>
          </Link>
        ))}
      </View>
      {hidden > 0 ? (
        <Button
          tone="quiet"
          testID={`squad-rounds-all-${squad.id}`}
          label={
            all
              ? `Show only the latest ${ROUNDS_SHOWN}`
              : `Show ${plural(hidden, 'earlier round', 'earlier rounds')}${hiddenOpen ? ` (${hiddenOpen} open)` : ''}`
          }
          onPress={() => setAll((v) => !v)}
        />
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  head: { gap: space.xs },
  columns: { gap: space.lg },
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  main: { gap: space.lg },
  mainWide: { flex: 3 },
  side: { flex: 2 },
  round: {
    minHeight: TOUCH_MIN + 16,
    borderTopWidth: 1,
    borderTopColor: colors.line,
    paddingVertical: space.md,
    borderRadius: radius.sm,
  },
  roundInner: { gap: space.xs, width: '100%' },
  roundHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  roundName: { flex: 1 },
});
