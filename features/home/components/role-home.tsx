import { can, ROLE_LABELS } from '@/features/access/permissions';
import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { ageInYears, todayIso } from '@/features/athletes/age';
import { useAthletesQuery } from '@/features/athletes/api/get-athletes';
import { ReviewsTeaser } from '@/features/care/components/reviews-teaser';
import { OpenRounds } from '@/features/screening/components/open-rounds';
import { LazySquadWatch } from '@/features/progress/components/lazy-squad-watch';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, space } from '@/features/ui/theme';
import { HOME_INTROS, homeGreeting } from '../intros';
import { SquadCards } from './squad-cards';
import { consentGapLines, hasConsentGaps } from '../consent-gaps';

export function RoleHome() {
  const { membership, me } = useActiveClub();
  const intro = HOME_INTROS[membership.role];
  return (
    <View style={styles.wrap} testID={`home-${membership.role}`}>
      <View style={styles.head}>
        <Text variant="small">
          {membership.clubName} · {ROLE_LABELS[membership.role]}
        </Text>
        <Text variant="title" accessibilityRole="header">
          {intro.title}
        </Text>
        <Text>{homeGreeting(me.user.displayName.split(' ')[0] ?? '', membership.role)}</Text>
      </View>
      {/* The ways on sit under the head, not under the lists: lists that arrive later would push them
          down under a thumb about to tap them. */}
      {can(membership.role, 'roster.read') ? (
        <View style={styles.row}>
          {membership.role === 'head_coach' ? (
            <Link href="/trends" style={[styles.link, styles.linkGap]} testID="home-trends-link">
              <Text variant="label">Squad trends over the season →</Text>
            </Link>
          ) : null}
          {/* The people who run or follow the sessions; the admin finds it in the menu. */}
          {can(membership.role, 'training.read') && membership.role !== 'admin' ? (
            <Link href="/training" style={[styles.link, styles.linkGap]} testID="home-training-link">
              <Text variant="label">Training sheets →</Text>
            </Link>
          ) : null}
          <Link href="/athletes" style={styles.link}>
            <Text variant="label">See all athletes →</Text>
          </Link>
        </View>
      ) : null}
      {!can(membership.role, 'roster.read') ? (
        <ParentChildren />
      ) : membership.role === 'physio' ? (
        <>
          <ReviewsTeaser />
          <SquadCards />
        </>
      ) : membership.role === 'tester' || membership.role === 'head_coach' ? (
        // The squads with their open screening rounds and a way straight back in; for the head coach, below
        // them (arriving later, it moves nothing above), what to act on in each squad.
        <>
          <OpenRounds />
          {membership.role === 'head_coach' ? <LazySquadWatch /> : null}
        </>
      ) : (
        <>
          <SquadCards />
          {/* Below the squads: arriving with the athletes list, above them it would push the cards down. */}
          {membership.role === 'admin' ? <ConsentGaps /> : null}
        </>
      )}
    </View>
  );
}

/** The admin's to-do: the families' decisions not recorded yet, and the way to record them. */
function ConsentGaps() {
  const athletes = useAthletesQuery();
  if (!athletes.data) return null;
  const lines = consentGapLines(athletes.data.athletes);
  if (!lines.length) return null;
  return (
    <Card testID="consent-gaps">
      <Text variant="heading">Families</Text>
      {lines.map((l) => (
        <Text key={l}>{l}</Text>
      ))}
      {hasConsentGaps(athletes.data.athletes) ? (
        <Link href="/athletes?needs=family" style={styles.link} testID="consent-gaps-who">
          <Text variant="label">See who, and record them from each athlete&apos;s page →</Text>
        </Link>
      ) : null}
    </Card>
  );
}

function ParentChildren() {
  const athletes = useAthletesQuery();
  const { isTabletUp } = useBreakpoints();
  if (athletes.error) return <Notice tone="error">{athletes.error.message}</Notice>;
  if (athletes.isPending) return <Text>Loading…</Text>;
  if (athletes.data.athletes.length === 0) {
    return (
      <Notice title="No child is linked to your account yet" testID="parent-no-child">
        <Text>
          Your account is ready, but the club has not linked it to your child yet. Ask the club&apos;s admin or your child&apos;s coach to link you: they open
          your child&apos;s page in Squadline and add you under &quot;Parents and guardians&quot;, using the e-mail address you signed in with. Your child then
          appears here.
        </Text>
      </Notice>
    );
  }
  return (
    <View style={styles.wrap}>
      <View style={[styles.wrap, isTabletUp && styles.row]}>
        {athletes.data.athletes.map((a) => (
          <Card key={a.id} testID="child-card" style={isTabletUp ? styles.childWide : undefined}>
            <Text variant="heading">
              {a.firstName} {a.lastName}
            </Text>
            <Text variant="small">
              {ageInYears(a.dateOfBirth, todayIso())} years · {a.squadName ?? 'No squad'}
            </Text>
            <Text style={a.consents.screening?.granted ? undefined : styles.warn}>
              Screens and exercises:{' '}
              {a.consents.screening?.granted ? 'agreed' : a.consents.screening ? 'stopped (not screened)' : 'not agreed yet (not screened)'}
            </Text>
            <Text>Photos: {a.consents.photos?.granted ? 'agreed, screening photos may be taken' : 'no photos are taken'}</Text>
            <Link href={`/family/${a.id}`} style={styles.link} testID="child-summary-link">
              <Text variant="label">{`${a.firstName}'s screen summary and exercises →`}</Text>
            </Link>
            <Link href={`/athletes/${a.id}`} style={styles.link} testID="child-details-link">
              <Text variant="label">Details and your consent →</Text>
            </Link>
          </Card>
        ))}
      </View>
      <Notice title="About screening">
        Coaches watch a few simple movements (squats, landings, balance) to spot habits such as knees that fall inward. Screening is not a medical diagnosis: if
        your child has pain, please see a physiotherapist or doctor.
      </Notice>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  head: { gap: space.xs },
  link: { minHeight: 48, paddingVertical: space.md },
  linkGap: { marginRight: space.xl },
  row: { flexDirection: 'row', flexWrap: 'wrap' },
  warn: { color: colors.amber, fontFamily: fonts.bold },
  childWide: { flexBasis: 320, flexGrow: 1, maxWidth: 560 },
});
