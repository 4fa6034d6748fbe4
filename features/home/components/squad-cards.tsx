import { plural } from '@/features/ui/plural';
import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { can } from '@/features/access/permissions';
import { useSquadsQuery } from '@/features/athletes/api/get-squads';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, space, TOUCH_MIN } from '@/features/ui/theme';

/** The club's squads, each with the ways into it the reader's role has (its training sheet, its trends). */
export function SquadCards() {
  const squads = useSquadsQuery();
  const { role } = useActiveClub().membership;
  const { isTabletUp } = useBreakpoints();
  if (squads.error) return <Notice tone="error">{squads.error.message}</Notice>;
  if (squads.isPending) return <Text>Loading squads…</Text>;
  return (
    <View style={[styles.grid, isTabletUp && styles.gridWide]}>
      {squads.data.squads.map((s) => (
        <Card key={s.id} style={isTabletUp ? styles.cardWide : undefined} testID={`squad-card-${s.id}`}>
          <Text variant="heading">{s.name}</Text>
          <Text variant="small">{plural(s.athleteCount, 'athlete', 'athletes')}</Text>
          <View style={styles.links}>
            {can(role, 'training.read') ? (
              <Link href={`/training?squad=${s.id}`} style={styles.link}>
                <Text variant="label" style={styles.linkText}>
                  Training sheet →
                </Text>
              </Link>
            ) : null}
            {can(role, 'trends.read') ? (
              <Link href={`/trends?squad=${s.id}`} style={styles.link}>
                <Text variant="label" style={styles.linkText}>
                  Squad trends →
                </Text>
              </Link>
            ) : null}
          </View>
        </Card>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { gap: space.md },
  gridWide: { flexDirection: 'row', flexWrap: 'wrap' },
  cardWide: { flexBasis: 280, flexGrow: 1 },
  links: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg },
  link: { minHeight: TOUCH_MIN, justifyContent: 'center', display: 'flex' },
  linkText: { color: colors.pine },
});
