import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { ageInYears, todayIso } from '@/features/athletes/age';
import { can } from '@/features/access/permissions';
import { ClearanceBadge, PainWaitingTag } from '@/features/care/components/clearance-badge';
import { useActiveClub } from '@/features/session/active-club';
import { Text } from '@/features/ui/components/text';
import { colors, radius, space, TOUCH_MIN } from '@/features/ui/theme';
import type { Athlete } from '../api/types';
import { TAKING_PART_TAGS } from '../taking-part';

/** One athlete in their squad's group of the list (the group names the squad). */
export function AthleteRow({ athlete }: { athlete: Athlete }) {
  const { membership } = useActiveClub();
  const noPhotos = athlete.consents.photos?.granted !== true;
  const notTakingPart = athlete.consents.screening?.granted !== true;
  // For those who link parents (a tester's list stays on what matters courtside).
  const noParent = athlete.guardianCount === 0 && can(membership.role, 'guardians.manage');
  return (
    <Link href={`/athletes/${athlete.id}`} style={styles.row} testID={`athlete-${athlete.id}`}>
      <View style={styles.inner}>
        <View style={styles.main}>
          <Text variant="label">
            {athlete.firstName} {athlete.lastName}
          </Text>
          <Text variant="small">
            {ageInYears(athlete.dateOfBirth, todayIso())} y · {athlete.sex === 'female' ? 'F' : 'M'} · racket {athlete.racketHand}
          </Text>
          {/* Pain waiting for a physiotherapist is named in the list too (it looked like a child with nothing to note). */}
          <PainWaitingTag athleteId={athlete.id} />
          <ClearanceBadge clearance={athlete.clearance} />
        </View>
        {athlete.archived ? (
          <View style={[styles.tag, styles.archivedTag]}>
            <Text variant="small">Archived</Text>
          </View>
        ) : notTakingPart || noPhotos || noParent ? (
          <View style={styles.tags}>
            {notTakingPart ? (
              <View style={styles.tag}>
                <Text variant="small" style={styles.tagText}>
                  {TAKING_PART_TAGS[athlete.consents.screening ? 'refused' : 'unrecorded']}
                </Text>
              </View>
            ) : null}
            {noPhotos ? (
              <View style={styles.tag}>
                <Text variant="small" style={styles.tagText}>
                  {athlete.consents.photos ? 'No photo consent' : 'No photo decision yet'}
                </Text>
              </View>
            ) : null}
            {noParent ? (
              <View style={[styles.tag, styles.plainTag]}>
                <Text variant="small">No parent linked</Text>
              </View>
            ) : null}
          </View>
        ) : null}
      </View>
    </Link>
  );
}

const styles = StyleSheet.create({
  row: { minHeight: TOUCH_MIN + 8, borderBottomWidth: 1, borderBottomColor: colors.line, paddingVertical: space.sm },
  inner: { flexDirection: 'row', alignItems: 'center', gap: space.md, width: '100%' },
  main: { flex: 1, gap: 2 },
  tags: { gap: space.xs, alignItems: 'flex-end' },
  tag: { backgroundColor: colors.amberSoft, borderRadius: radius.sm, paddingHorizontal: space.sm, paddingVertical: 2 },
  tagText: { color: colors.amber },
  archivedTag: { backgroundColor: colors.line },
  plainTag: { backgroundColor: colors.line },
});
