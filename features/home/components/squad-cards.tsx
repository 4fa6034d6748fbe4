import { plural } from '@/features/ui/plural';
import { StyleSheet, View } from 'react-native';
import { useSquadsQuery } from '@/features/athletes/api/get-squads';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { space } from '@/features/ui/theme';

export function SquadCards() {
  const squads = useSquadsQuery();
  const { isTabletUp } = useBreakpoints();
  if (squads.error) return <Notice tone="error">{squads.error.message}</Notice>;
  if (squads.isPending) return <Text>Loading squads…</Text>;
  return (
    <View style={[styles.grid, isTabletUp && styles.gridWide]}>
      {squads.data.squads.map((s) => (
        <Card key={s.id} style={isTabletUp ? styles.cardWide : undefined}>
          <Text variant="heading">{s.name}</Text>
          <Text variant="small">{plural(s.athleteCount, 'athlete', 'athletes')}</Text>
        </Card>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { gap: space.md },
  gridWide: { flexDirection: 'row', flexWrap: 'wrap' },
  cardWide: { flexBasis: 280, flexGrow: 1 },
});
