import { StyleSheet, View } from 'react-native';
import { ageInYears, todayIso } from '@/features/athletes/age';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { space } from '@/features/ui/theme';
import { useAthleteQuery } from '../api/get-athlete';
import type { ConsentView } from '../api/types';

function consentText(c: ConsentView, yes: string, no: string) {
  if (!c) return 'Not recorded yet';
  return `${c.granted ? yes : no} (recorded ${c.decidedOn})`;
}

export function AthleteProfile({ id }: { id: string }) {
  const query = useAthleteQuery(id);
  if (query.isPending) return <Text>Loading…</Text>;
  if (query.error) return <Notice tone="error">{query.error.message}</Notice>;
  const a = query.data.athlete;
  return (
    <View style={styles.wrap}>
      <Text variant="title" accessibilityRole="header">
        {a.firstName} {a.lastName}
      </Text>
      <Card>
        <Fact label="Squad" value={a.squadName ?? 'No squad'} />
        <Fact label="Age" value={`${ageInYears(a.dateOfBirth, todayIso())} years (born ${a.dateOfBirth})`} />
        <Fact label="Sex" value={a.sex === 'female' ? 'Female' : 'Male'} />
        <Fact label="Racket hand" value={a.racketHand === 'left' ? 'Left' : 'Right'} />
        <Fact label="Take-off leg" value={a.takeOffLeg === 'left' ? 'Left' : 'Right'} />
      </Card>
      <Card>
        <Text variant="heading">Consent</Text>
        <Fact label="Photos" value={consentText(a.consents.photos, 'Photos may be taken', 'No photos')} />
        <Fact label="E-mail summaries" value={consentText(a.consents.emailSummaries, 'Summaries may be e-mailed', 'No e-mails')} />
      </Card>
    </View>
  );
}

function Fact({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.fact}>
      <Text variant="small">{label}</Text>
      <Text>{value}</Text>
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { gap: space.lg }, fact: { gap: 2 } });
