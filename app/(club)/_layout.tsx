import { Navigator, Redirect, Slot, usePathname } from 'expo-router';
import { can } from '@/features/access/permissions';
import { useMeQuery } from '@/features/auth/api/get-me';
import { signedOutOnThisDevice } from '@/features/auth/return-to';
import { DeviceGate } from '@/features/offline/components/device-gate';
import { ScreeningSync } from '@/features/screening/components/screening-sync';
import { ActiveClubProvider, useActiveClub } from '@/features/session/active-club';
import { AppShell, ShellFrame } from '@/features/shell/components/app-shell';
import { FullScreenMessage } from '@/features/shell/components/full-screen-message';

export default function ClubLayout() {
  // The navigator is mounted from the first render, before the session is known: it holds the address
  // the page was opened at (a layout that renders no navigator while it waits sends the router back
  // to the home route, and a slow answer lost a deep link).
  return (
    <Navigator>
      <SignedIn />
    </Navigator>
  );
}

function SignedIn() {
  const me = useMeQuery();
  const pathname = usePathname();
  // The frame is also what the pre-rendered HTML shows: the page's place and head at first paint.
  if (me.isPending) return <ShellFrame />;
  if (me.error) return <FullScreenMessage message={me.error.message} />;
  // Back to this page after signing in (a link in an e-mail to a child's summary, a review); not after
  // signing out, when the next person on a shared phone starts at their own home.
  if (!me.data) {
    const back = pathname && pathname !== '/' && !signedOutOnThisDevice();
    return <Redirect href={back ? { pathname: '/sign-in', params: { next: pathname } } : '/sign-in'} />;
  }
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
