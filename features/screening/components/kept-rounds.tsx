import { plural } from '@/features/ui/plural';
import { Link } from 'expo-router';
import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '@/features/api/client';
import { keptWithPrefix } from '@/features/offline/device-cache';
import { ROUND_KEPT_PREFIX } from '@/features/screening/api/keys';
import type { RoundDetail } from '@/features/screening/contract';
import { useActiveClub } from '@/features/session/active-club';
import { Card } from '@/features/ui/components/card';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, fonts, space, TOUCH_MIN } from '@/features/ui/theme';
import { formatDate } from '@/features/ui/format-date';

/**
 * Without a connection the list of rounds cannot be read, but the rounds this tester opened are kept on
 * the phone: they are offered here. Any other error is shown as it is.
 */
export function RoundsUnavailable({ error, withTitle = false }: { error: Error; withTitle?: boolean }) {
  if (!(error instanceof ApiError) || error.status !== 0) return <Notice tone="error">{error.message}</Notice>;
  return <KeptRounds withTitle={withTitle} />;
}

function KeptRounds({ withTitle }: { withTitle: boolean }) {
  const { membership } = useActiveClub();
  const [rounds, setRounds] = useState<RoundDetail[] | null>(null);
  useEffect(() => {
    let live = true;
    void keptWithPrefix<RoundDetail>(ROUND_KEPT_PREFIX, membership.clubId).then((r) => live && setRounds(r));
    return () => {
      live = false;
    };
  }, [membership.clubId]);
  return (
    <View style={styles.wrap} testID="kept-rounds">
      {withTitle ? (
        <Text variant="title" accessibilityRole="header">
          Screening
        </Text>
      ) : null}
      <Notice title="No connection">
        {rounds && rounds.length > 0
          ? 'The rounds you opened on this phone are kept here: screening works as usual and is sent when the connection is back.'
          : 'No round is kept on this phone yet. Open a round once with a connection to screen it without one.'}
      </Notice>
      {rounds && rounds.length > 0 ? (
        <Card style={styles.list}>
          <Text variant="heading">Kept on this phone ({rounds.length})</Text>
          {rounds.map((r) => (
            <Link key={r.round.id} href={`/screening/rounds/${r.round.id}`} style={styles.row}>
              <View style={styles.rowInner}>
                <View style={styles.rowMain}>
                  <Text variant="label" style={styles.name}>
                    {r.round.name}
                  </Text>
                  <Text variant="small">
                    {r.round.squadName} · {formatDate(r.round.screenedOn)} · {plural(r.athletes.length, 'athlete', 'athletes')}
                  </Text>
                </View>
                <Text style={styles.chevron}>›</Text>
              </View>
            </Link>
          ))}
        </Card>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  list: { gap: space.sm },
  row: { minHeight: TOUCH_MIN + 20, borderTopWidth: 1, borderTopColor: colors.line, paddingVertical: space.md },
  rowInner: { flexDirection: 'row', alignItems: 'center', gap: space.md, width: '100%' },
  rowMain: { flex: 1, gap: space.xs },
  name: { fontSize: 18 },
  chevron: { fontFamily: fonts.bold, fontSize: 28, color: colors.inkMuted },
});
