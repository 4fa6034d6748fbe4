import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { isStaff } from '@/features/access/permissions';
import { useActiveClub } from '@/features/session/active-club';
import { Text } from '@/features/ui/components/text';
import { space } from '@/features/ui/theme';
import { LazyCarePanels } from './lazy-care-panels';

/** Where the athlete page's "Clearance and notes" link leads (below the charts). */
export const ATHLETE_CARE_ANCHOR = 'athlete-care';

/** On an athlete's page: clearance and notes for staff; for a parent, the way to the family summary. */
export function AthleteCare({ athleteId }: { athleteId: string }) {
  const { membership } = useActiveClub();
  if (!isStaff(membership.role)) {
    return (
      <Link href={`/family/${athleteId}`} style={styles.link}>
        <Text variant="label">Screen summary, exercises and notes →</Text>
      </Link>
    );
  }
  return (
    <View nativeID={ATHLETE_CARE_ANCHOR} style={styles.care}>
      <LazyCarePanels athleteId={athleteId} />
    </View>
  );
}

const styles = StyleSheet.create({ link: { minHeight: 48, paddingVertical: space.md }, care: { gap: space.lg } });
