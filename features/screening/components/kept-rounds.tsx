import { Link } from 'expo-router';
import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '@/features/api/client';
import { keptWithPrefix } from '@/features/offline/device-cache';
import { ROUND_KEPT_PREFIX } from '@/features/screening/api/keys';
import type { RoundDetail } from '@/features/screening/contract';
import { useActiveClub } from '@/features/session/active-club';
import { Notice } from '@/features/ui/components/notice';
import { Text } from '@/features/ui/components/text';
import { colors, space, TOUCH_MIN } from '@/features/ui/theme';

/**
 * Without a connection the list of rounds cannot be read, but the rounds this tester opened are kept on
 * the phone: they are offered here. Any other error is shown as it is.
 */
export function RoundsUnavailable({ error }: { error: Error }) {
  if (!(error instanceof ApiError) || error.status !== 0) return <Notice tone="error">{error.message}</Notice>;
  return <KeptRounds />;
}

function KeptRounds() {
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
      <Notice title="No connection">
        {rounds && rounds.length > 0
          ? 'The rounds you opened on this phone are kept here: screening works as usual and is sent when the connection is back.'
          : 'No round is kept on this phone yet. Open a round once with a connection to screen it without one.'}
      </Notice>
      {(rounds ?? []).map((r) => (
        <Link key={r.round.id} href={`/screening/rounds/${r.round.id}`} style={styles.row}>
          <View>
            <Text variant="label">{r.round.name}</Text>
            <Text variant="small">
              {r.round.squadName} · {r.round.screenedOn} · {r.athletes.length} athletes
            </Text>
          </View>
        </Link>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  row: { minHeight: TOUCH_MIN + 12, paddingVertical: space.md, borderTopWidth: 1, borderTopColor: colors.line },
});
