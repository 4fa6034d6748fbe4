import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { space } from '@/features/ui/theme';
import { useAthletesQuery } from '../api/get-athletes';
import type { Athlete } from '../api/types';
import { AthleteRow } from './athlete-row';

/** Every athlete of the club, grouped by squad, with a name filter. Side by side on wide screens. */
export function AthleteList() {
  const athletes = useAthletesQuery();
  const [filter, setFilter] = useState('');
  const { isWide } = useBreakpoints();
  const groups = useMemo(() => {
    const needle = filter.trim().toLowerCase();
    const map = new Map<string, Athlete[]>();
    for (const a of athletes.data?.athletes ?? []) {
      if (needle && !`${a.firstName} ${a.lastName}`.toLowerCase().includes(needle)) continue;
      const key = a.squadName ?? 'No squad';
      map.set(key, [...(map.get(key) ?? []), a]);
    }
    return [...map.entries()].sort(([a], [b]) => a.localeCompare(b));
  }, [athletes.data, filter]);

  if (athletes.error) return <Notice tone="error">{athletes.error.message}</Notice>;
  return (
    <View style={styles.wrap}>
      <TextField label="Find an athlete" placeholder="Type a name" value={filter} onChangeText={setFilter} autoCorrect={false} />
      {athletes.isPending ? <Text>Loading athletes…</Text> : null}
      {!athletes.isPending && groups.length === 0 ? <Text>No athlete matches “{filter}”.</Text> : null}
      <View style={[styles.groups, isWide && styles.groupsWide]}>
        {groups.map(([squad, list]) => (
          <Card key={squad} style={isWide ? styles.groupWide : undefined}>
            <Text variant="heading">
              {squad} <Text variant="small">({list.length})</Text>
            </Text>
            <View>
              {list.map((a) => (
                <AthleteRow key={a.id} athlete={a} />
              ))}
            </View>
          </Card>
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  groups: { gap: space.lg },
  groupsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  groupWide: { flex: 1 },
});
