import { useQuery } from '@tanstack/react-query';
import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { api } from '@/features/api/client';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Card } from '@/features/ui/components/card';
import { Text } from '@/features/ui/components/text';
import { colors, space, TOUCH_MIN } from '@/features/ui/theme';
import { progressKeys, PROGRESS_STALE_MS } from '../api/keys';
import { watchLines, type SquadWatch } from '../watch';

/**
 * The head coach's home, below the rounds: each squad in a few lines (pain waiting, referrals, the
 * physiotherapist's changes, the growth-spurt window, re-screens due), with the way to its trends.
 */
export function SquadWatchCard() {
  const { membership } = useActiveClub();
  const { isTabletUp } = useBreakpoints();
  const query = useQuery({
    queryKey: progressKeys.watch(membership.clubId),
    queryFn: () => api<{ squads: SquadWatch[] }>('/trends/watch'),
    staleTime: PROGRESS_STALE_MS,
  });
  if (!query.data || query.data.squads.length === 0) return null;
  return (
    <Card testID="squad-watch">
      <Text variant="heading">What to act on</Text>
      {/* Squads side by side on a wide screen, as the round cards above them. */}
      <View style={isTabletUp ? styles.grid : undefined}>
        {query.data.squads.map((w) => {
          const lines = watchLines(w);
          return (
            <View key={w.squadId} style={[styles.squad, isTabletUp && styles.cell]} testID={`squad-watch-${w.squadId}`}>
              <Text variant="label">{w.name}</Text>
              {lines.length === 0 ? <Text variant="small">Nothing waiting: no pain undecided, no referral, no re-screen due.</Text> : null}
              {/* Each line opens the squad's table sorted or filtered to show who. */}
              {lines.map((l) => (
                <Link
                  key={l.text}
                  href={`/trends?squad=${w.squadId}${l.open.sort ? `&sort=${l.open.sort}` : ''}${l.open.band ? `&band=${l.open.band}` : ''}`}
                  style={styles.link}
                >
                  <Text style={l.stop ? styles.stop : styles.lineText}>{`• ${l.text} →`}</Text>
                </Link>
              ))}
              <Link href={`/trends?squad=${w.squadId}`} style={styles.link}>
                <Text variant="label" style={styles.linkText}>{`${w.name}: trends and who →`}</Text>
              </Link>
            </View>
          );
        })}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  squad: { gap: space.xs, paddingTop: space.sm },
  grid: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg },
  cell: { flexBasis: 280, flexGrow: 1, flexShrink: 1 },
  stop: { color: colors.brick, fontWeight: '700', textDecorationLine: 'underline' },
  lineText: { color: colors.ink, textDecorationLine: 'underline' },
  // A column: a link is a flex row on the web, and centring it put each line in the middle of the card.
  link: { minHeight: TOUCH_MIN, justifyContent: 'center', display: 'flex', flexDirection: 'column', alignItems: 'flex-start' },
  linkText: { color: colors.pine },
});
