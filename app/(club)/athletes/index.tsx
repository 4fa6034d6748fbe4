import { Link } from 'expo-router';
import { can } from '@/features/access/permissions';
import { AthleteList } from '@/features/athletes/components/athlete-list';
import { useActiveClub } from '@/features/session/active-club';
import { Notice } from '@/features/ui/components/notice';
import { Page } from '@/features/ui/components/page';
import { Text } from '@/features/ui/components/text';
import { StyleSheet } from 'react-native';
import { colors, fonts } from '@/features/ui/theme';

export default function AthletesScreen() {
  // The roster is the staff's list (with their badges and archive); a parent's children are on their home.
  const staff = can(useActiveClub().membership.role, 'roster.read');
  return (
    <Page title="Athletes">
      <Text variant="title" accessibilityRole="header">
        Athletes
      </Text>
      {staff ? (
        <AthleteList />
      ) : (
        <Notice title="For the club's staff" testID="roster-staff-only">
          <Text>
            This list is for the coaches and the club&apos;s staff. Your children are on{' '}
            <Link href="/" style={styles.link}>
              your home page
            </Link>
            .
          </Text>
        </Notice>
      )}
    </Page>
  );
}

const styles = StyleSheet.create({ link: { color: colors.pine, fontFamily: fonts.bold, textDecorationLine: 'underline' } });
