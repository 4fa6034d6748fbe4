import { can } from '@/features/access/permissions';
import { Link, useLocalSearchParams } from 'expo-router';
import { useMemo, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { TextField } from '@/features/ui/components/text-field';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { useAthletesQuery } from '../api/get-athletes';
import type { Athlete } from '../api/types';
import { AthleteRow } from './athlete-row';

/** Every athlete of the club, grouped by squad, with a name filter. Side by side on wide screens. */
export function AthleteList() {
  const { membership } = useActiveClub();
  const [showArchived, setShowArchived] = useState(false);
  const athletes = useAthletesQuery({ includeArchived: showArchived });
  const [filter, setFilter] = useState('');
  // From the admin's home ("See who"): only those missing a family decision or a parent account.
  const params = useLocalSearchParams<{ needs?: string }>();
  const [gapsOnly, setGapsOnly] = useState(params.needs === 'family');
  const { isWide, isTabletUp } = useBreakpoints();
  const groups = useMemo(() => {
    const needle = filter.trim().toLowerCase();
    const map = new Map<string, Athlete[]>();
    for (const a of athletes.data?.athletes ?? []) {
      if (needle && !`${a.firstName} ${a.lastName}`.toLowerCase().includes(needle)) continue;
      // The admin home's count (features/home/consent-gaps.ts), kept here to stay out of the shared chunk.
      if (gapsOnly && (a.archived || (a.consents.screening && a.consents.photos && a.guardianCount !== 0))) continue;
      const key = a.squadName ?? 'No squad';
      map.set(key, [...(map.get(key) ?? []), a]);
    }
    return [...map.entries()].sort(([a], [b]) => a.localeCompare(b));
  }, [athletes.data, filter, gapsOnly]);

  return (
    <View style={styles.wrap}>
      {can(membership.role, 'roster.manage') ? (
        <View style={[styles.actions, isTabletUp && styles.actionsWide]}>
          <ActionLink href="/athletes/new" label="Add athlete" testID="add-athlete" primary />
          <ActionLink href="/athletes/import" label="Import from CSV" testID="import-csv" />
          <ActionLink href="/squads" label="Manage squads" testID="manage-squads" />
        </View>
      ) : null}
      <View style={[styles.tools, isTabletUp && styles.toolsWide]}>
        <View style={styles.search}>
          <TextField label="Find an athlete" placeholder="Type a name" value={filter} onChangeText={setFilter} autoCorrect={false} />
        </View>
        <Pressable
          accessibilityRole="checkbox"
          aria-checked={showArchived}
          testID="show-archived"
          onPress={() => setShowArchived((v) => !v)}
          style={styles.toggle}
        >
          <View style={[styles.box, showArchived && styles.boxOn]}>{showArchived ? <Text style={styles.tick}>✓</Text> : null}</View>
          <Text>Show archived athletes</Text>
        </Pressable>
      </View>
      {gapsOnly ? (
        <Notice testID="athletes-gaps-only">
          <Text>Only the athletes missing a screening or photo decision, or a linked parent account.</Text>
          <Button label="Show every athlete" tone="quiet" onPress={() => setGapsOnly(false)} testID="athletes-show-all" />
        </Notice>
      ) : null}
      {athletes.error ? <Notice tone="error">{athletes.error.message}</Notice> : null}
      {athletes.isPending ? <Text>Loading athletes…</Text> : null}
      {athletes.data && groups.length === 0 ? <Text>{filter ? `No athlete matches “${filter}”.` : 'No athletes yet.'}</Text> : null}
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

function ActionLink({ href, label, testID, primary = false }: { href: string; label: string; testID: string; primary?: boolean }) {
  return (
    <Link href={href as never} testID={testID} style={[styles.action, primary ? styles.actionPrimary : styles.actionSecondary]}>
      <Text style={[styles.actionText, primary && styles.actionTextPrimary]}>{label}</Text>
    </Link>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  actions: { gap: space.sm },
  actionsWide: { flexDirection: 'row', flexWrap: 'wrap' },
  action: {
    minHeight: TOUCH_MIN,
    paddingHorizontal: space.lg,
    paddingVertical: space.md,
    borderRadius: radius.md,
    borderWidth: 2,
    textAlign: 'center',
  },
  actionPrimary: { backgroundColor: colors.pine, borderColor: colors.pine },
  actionSecondary: { backgroundColor: colors.surface, borderColor: colors.pine },
  actionText: { fontFamily: fonts.bold, fontSize: 17, color: colors.pine },
  actionTextPrimary: { color: '#fff' },
  tools: { gap: space.md },
  toolsWide: { flexDirection: 'row', alignItems: 'flex-end' },
  search: { flexGrow: 1, flexShrink: 1, minWidth: 0 },
  toggle: { minHeight: TOUCH_MIN, flexDirection: 'row', alignItems: 'center', gap: space.sm, paddingHorizontal: space.xs },
  box: {
    width: 26,
    height: 26,
    borderRadius: radius.sm,
    borderWidth: 2,
    borderColor: colors.pine,
    alignItems: 'center',
    justifyContent: 'center',
    backgroundColor: colors.surface,
  },
  boxOn: { backgroundColor: colors.pine },
  tick: { color: '#fff', fontFamily: fonts.bold, fontSize: 16, lineHeight: 18 },
  groups: { gap: space.lg },
  groupsWide: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-start' },
  groupWide: { flexGrow: 1, flexBasis: 320 },
});
