import { Link } from 'expo-router';
import { can, isStaff } from '@/features/access/permissions';
import { ATHLETE_CARE_ANCHOR } from '@/features/care/components/athlete-care';
import { ClearanceBadge } from '@/features/care/components/clearance-badge';
import { usePainWaitingOf } from '@/features/care/api/get-clearances';
import { scrollToId } from '@/features/ui/scroll-to';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useActiveClub } from '@/features/session/active-club';
import { usePageTitle } from '@/features/ui/page-title';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Button } from '@/features/ui/components/button';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import { ageInYears, todayIso } from '../age';
import { useAthleteQuery } from '../api/get-athlete';
import type { Athlete } from '../api/types';
import { useUpdateAthleteMutation } from '../api/update-athlete';
import { SEX_LABELS, SIDE_LABELS } from '../schemas';
import { ArchiveControl } from './archive-control';
import { LazyAthleteForm } from './lazy-athlete-form';
import { MoveSquad } from './move-squad';
import { formatDate } from '@/features/ui/format-date';

/** Who the athlete is, and (for admins and head coaches) editing, moving and archiving. */
export function AthleteProfile({ id }: { id: string }) {
  const query = useAthleteQuery(id);
  const { membership } = useActiveClub();
  const { isTabletUp } = useBreakpoints();
  const [editing, setEditing] = useState(false);
  usePageTitle(query.data ? `${query.data.athlete.firstName} ${query.data.athlete.lastName}` : 'Athlete');
  if (query.isPending) return <Text>Loading…</Text>;
  if (query.error) return <Notice tone="error">{query.error.message}</Notice>;
  const a = query.data.athlete;
  const manage = can(membership.role, 'roster.manage');
  return (
    <View style={styles.wrap}>
      <View style={styles.head}>
        <Text variant="title" accessibilityRole="header">
          {a.firstName} {a.lastName}
        </Text>
        <View style={styles.tags}>
          <Text variant="small">{a.squadName ?? 'No squad'}</Text>
          {/* Staff words ("⚠ Train with changes"); a family reads the decision in plain words on the child's summary page. */}
          {isStaff(membership.role) ? <ClearanceBadge clearance={a.clearance} /> : null}
          {a.archived ? (
            <View style={styles.archivedTag} testID="archived-tag">
              <Text variant="small" style={styles.archivedText}>
                Archived
              </Text>
            </View>
          ) : null}
        </View>
        {isStaff(membership.role) ? <HoldLine athlete={a} /> : null}
        {isStaff(membership.role) ? (
          // The physiotherapist's decision, the notes and the list of screenings sit below the history's
          // charts: one tap away. (The screenings' anchor is written out: importing it from the screening
          // feature would bring that module into this page's first download.)
          <View style={styles.jumps}>
            <Button
              tone="quiet"
              label="Clearance and notes ↓"
              onPress={() => scrollToId(ATHLETE_CARE_ANCHOR, true, true)}
              testID="to-athlete-care"
              style={styles.toCare}
            />
            <Button
              tone="quiet"
              label="Screenings ↓"
              onPress={() => scrollToId('athlete-screenings', true, true)}
              testID="to-athlete-screenings"
              style={styles.toCare}
            />
          </View>
        ) : null}
      </View>
      <View style={[styles.cols, isTabletUp && styles.colsWide]}>
        <Card style={isTabletUp ? [styles.col, styles.colMain] : undefined}>
          <View style={styles.cardHead}>
            <Text variant="heading">{editing ? 'Edit details' : 'Details'}</Text>
            {manage && !editing && !a.archived ? <Button label="Edit" tone="secondary" testID="athlete-edit" onPress={() => setEditing(true)} /> : null}
          </View>
          {editing ? <EditDetails athlete={a} onDone={() => setEditing(false)} /> : <Facts athlete={a} />}
        </Card>
        {manage ? (
          <Card style={isTabletUp ? styles.col : undefined}>
            <Text variant="heading">Squad and status</Text>
            {!a.archived ? <MoveSquad athlete={a} /> : null}
            <ArchiveControl athlete={a} />
            {can(membership.role, 'audit.read') ? (
              <Link href={`/audit?athleteId=${a.id}`} style={styles.trailLink} testID="athlete-audit-link">
                <Text variant="label">{`Who viewed or changed ${a.firstName}'s records →`}</Text>
              </Link>
            ) : null}
          </Card>
        ) : null}
      </View>
    </View>
  );
}

/**
 * At the top of the page, where a coach checking one child reads it first: pain reported at the newest
 * screen with no physiotherapist's decision since, or a referral (the panel with the words is further down).
 */
function HoldLine({ athlete: a }: { athlete: Athlete }) {
  const pain = usePainWaitingOf(a.id);
  if (pain) {
    return (
      <Notice tone="error" title="Pain reported, no physiotherapist's decision yet" testID="athlete-hold">
        {`At the screen of ${formatDate(pain.screenedOn)}. No loaded strength work and no landing work until a physiotherapist clears ${a.firstName}.`}
      </Notice>
    );
  }
  if (a.clearance?.status === 'referred') {
    return (
      <Notice tone="error" title="Referred on" testID="athlete-hold">
        {`${a.clearance.setByName ?? 'A physiotherapist'} referred ${a.firstName} on (${formatDate(a.clearance.setAt.slice(0, 10))}). No loaded strength work and no landing work until a physiotherapist clears them.`}
      </Notice>
    );
  }
  return null;
}

function EditDetails({ athlete, onDone }: { athlete: Athlete; onDone: () => void }) {
  const update = useUpdateAthleteMutation(athlete.id);
  return (
    <LazyAthleteForm
      athlete={athlete}
      submitLabel="Save changes"
      onCancel={onDone}
      onSubmit={async (values) => {
        await update.mutateAsync(values);
        onDone();
      }}
    />
  );
}

function Facts({ athlete: a }: { athlete: Athlete }) {
  return (
    <View style={styles.facts}>
      <Fact label="Age" value={`${ageInYears(a.dateOfBirth, todayIso())} years (born ${formatDate(a.dateOfBirth)})`} wide />
      <Fact label="Sex" value={SEX_LABELS[a.sex]} />
      <Fact label="Racket hand" value={SIDE_LABELS[a.racketHand]} />
      <Fact label="Take-off leg" value={SIDE_LABELS[a.takeOffLeg]} />
    </View>
  );
}

/** Facts side by side as the width allows: the age on its own line on a phone, the three short ones under it. */
function Fact({ label, value, wide = false }: { label: string; value: string; wide?: boolean }) {
  return (
    <View style={[styles.fact, wide && styles.factWide]}>
      <Text variant="small">{label}</Text>
      <Text>{value}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  head: { gap: space.xs },
  tags: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  archivedTag: { backgroundColor: colors.amberSoft, borderRadius: radius.sm, paddingHorizontal: space.sm, paddingVertical: 2 },
  archivedText: { color: colors.amber, fontFamily: fonts.bold },
  cols: { gap: space.lg },
  toCare: { alignSelf: 'flex-start' },
  jumps: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md },
  trailLink: { minHeight: TOUCH_MIN, paddingVertical: space.md },
  colsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  col: { flexGrow: 1, flexBasis: 0, minWidth: 0 },
  colMain: { flexGrow: 2 },
  cardHead: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.md, flexWrap: 'wrap' },
  facts: { flexDirection: 'row', flexWrap: 'wrap', rowGap: space.md, columnGap: space.lg },
  fact: { gap: 2, flexGrow: 1, flexBasis: 80 },
  factWide: { flexBasis: 260 },
});
