import { plural } from '@/features/ui/plural';
import { useDeferredValue } from 'react';
import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { isOpenRound, isUntouchedRound, useClubRoundsQuery } from '@/features/screening/api/get-rounds';
import { can } from '@/features/access/permissions';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Card } from '@/features/ui/components/card';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { RoundsUnavailable } from './kept-rounds';
import { RoundProgress } from './round-progress';
import { formatDate } from '@/features/ui/format-date';
import { courtsideSquads } from '../courtside-order';
import { todayIsoLocal } from '../labels';

const SHOWN_PER_SQUAD = 2;

/**
 * For the home of testers and head coaches: each squad with its open screening rounds (newest first)
 * and a big way back into each.
 */
export function OpenRounds() {
  const live = useClubRoundsQuery();
  // Drawn in the background when the lists arrive (see ClubShell): the first date on a page sets up the
  // browser's calendar data, the largest part of this render in a profile.
  const bySquad = useDeferredValue(live.bySquad);
  const isPending = useDeferredValue(live.isPending);
  const error = live.error;
  const { isTabletUp } = useBreakpoints();
  // The head coach's; a tester's home stays on the rounds.
  const role = useActiveClub().membership.role;
  const showTrends = role === 'head_coach' && can(role, 'trends.read');
  if (error) return <RoundsUnavailable error={error} />;
  // Squads and rounds together: a squad card drawn before its rounds arrive would say "No open round"
  // and then grow, pushing everything below it.
  if (isPending) return <Text>Loading squads…</Text>;
  const today = todayIsoLocal();
  return (
    <View style={[styles.grid, isTabletUp && styles.gridWide]} testID="open-rounds">
      {courtsideSquads(bySquad, isOpenRound, today).map(({ squad, open }) => {
        return (
          <Card key={squad.id} style={isTabletUp ? styles.cardWide : undefined}>
            <Text variant="heading">{squad.name}</Text>
            <Text variant="small">{plural(squad.athleteCount, 'athlete', 'athletes')}</Text>
            {open.length === 0 ? (
              <Link href="/screening" style={styles.secondary}>
                <Text style={styles.secondaryText}>No open round. Open one →</Text>
              </Link>
            ) : (
              // One big button per squad, for the round that comes first (today's); an older round's way in
              // is a plain link, so the two are not mistaken for each other.
              open.slice(0, SHOWN_PER_SQUAD).map((r, k) => (
                <View key={r.id} style={styles.round}>
                  <Text variant="label">
                    {r.name} · {r.screenedOn === today ? `today, ${formatDate(r.screenedOn)}` : formatDate(r.screenedOn)}
                  </Text>
                  <RoundProgress round={r} />
                  <Link href={`/screening/rounds/${r.id}`} style={k ? styles.secondary : styles.primary} testID={`continue-round-${r.id}`}>
                    <Text style={k ? styles.secondaryText : styles.primaryText}>{isUntouchedRound(r) ? 'Start screening' : 'Continue screening'}</Text>
                  </Link>
                </View>
              ))
            )}
            {open.length > SHOWN_PER_SQUAD ? (
              <Link href={`/screening?squad=${squad.id}`} style={styles.secondary} testID={`all-open-rounds-${squad.id}`}>
                <Text style={styles.secondaryText}>All {open.length} open rounds →</Text>
              </Link>
            ) : null}
            {squad.lastSession ? (
              // Whether the corrective work goes on between screens, and the way to the squad's sheet.
              <View style={styles.round} testID={`squad-last-session-${squad.id}`}>
                <Text variant="small">
                  Last corrective session {formatDate(squad.lastSession.heldOn)} · {squad.lastSession.attended} took part
                </Text>
                <Link href={`/training?squad=${squad.id}`} style={styles.secondary}>
                  <Text style={styles.secondaryText}>Training sheet →</Text>
                </Link>
              </View>
            ) : null}
            {showTrends ? (
              // The head coach's way to the squad's season (flags, re-screens due), from the squad itself.
              <Link href={`/trends?squad=${squad.id}`} style={styles.secondary} testID={`squad-trends-${squad.id}`}>
                <Text style={styles.secondaryText}>Squad trends →</Text>
              </Link>
            ) : null}
          </Card>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { gap: space.md },
  gridWide: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-start' },
  cardWide: { flexBasis: 320, flexGrow: 1 },
  round: { gap: space.xs, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.md },
  primary: {
    minHeight: TOUCH_MIN + 8,
    backgroundColor: colors.pine,
    borderRadius: radius.md,
    paddingVertical: space.md,
    paddingHorizontal: space.lg,
    marginTop: space.xs,
    textAlign: 'center',
  },
  primaryText: { color: '#fff', fontFamily: fonts.bold, fontSize: 18 },
  secondary: { minHeight: TOUCH_MIN, paddingVertical: space.md },
  secondaryText: { color: colors.pine, fontFamily: fonts.bold },
});
