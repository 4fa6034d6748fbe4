import { can } from '@/features/access/permissions';
import { StyleSheet, View } from 'react-native';
import { useActiveClub } from '@/features/session/active-club';
import { useBreakpoints } from '@/features/ui/breakpoints';
import { space } from '@/features/ui/theme';
import { useAthleteQuery } from '../api/get-athlete';
import { ConsentPanel } from './consent-panel';
import { GuardiansPanel } from './guardians-panel';

/** Consent decisions and guardian links: side by side on a wide screen. */
export function AthleteRecords({ id }: { id: string }) {
  const query = useAthleteQuery(id);
  const { membership } = useActiveClub();
  const { isTabletUp } = useBreakpoints();
  if (!query.data) return null; // AthleteProfile shows loading and errors
  const athlete = query.data.athlete;
  return (
    <View style={[styles.cols, isTabletUp && styles.colsWide]}>
      <View style={isTabletUp ? styles.col : undefined}>
        <ConsentPanel athlete={athlete} />
      </View>
      {can(membership.role, 'guardians.read') ? (
        <View style={isTabletUp ? styles.col : undefined}>
          <GuardiansPanel athlete={athlete} />
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  cols: { gap: space.lg },
  colsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  col: { flexGrow: 1, flexBasis: 0, minWidth: 0 },
});
