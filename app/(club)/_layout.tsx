import { Redirect, Slot } from 'expo-router';
import { can } from '@/features/access/permissions';
import { useMeQuery } from '@/features/auth/api/get-me';
import { DeviceGate } from '@/features/offline/components/device-gate';
import { ScreeningSync } from '@/features/screening/components/screening-sync';
import { ActiveClubProvider, useActiveClub } from '@/features/session/active-club';
import { AppShell } from '@/features/shell/components/app-shell';
import { FullScreenMessage } from '@/features/shell/components/full-screen-message';

export default function ClubLayout() {
  const me = useMeQuery();
  if (me.isPending) return <FullScreenMessage busy />;
  if (me.error) return <FullScreenMessage message={me.error.message} />;
  if (!me.data) return <Redirect href="/sign-in" />;
  if (me.data.memberships.length === 0) {
    return <FullScreenMessage message="Your account is not part of any club yet. Ask your club admin for an invitation." />;
  }
  return (
    <ActiveClubProvider me={me.data}>
      <DeviceGate>
        <SyncForScreeners />
        <AppShell>
          <Slot />
        </AppShell>
      </DeviceGate>
    </ActiveClubProvider>
  );
}

/** Changes queued on this device are sent whatever screen is open; only people who screen queue any. */
function SyncForScreeners() {
  const { membership } = useActiveClub();
  return can(membership.role, 'screening.write') ? <ScreeningSync /> : null;
}
