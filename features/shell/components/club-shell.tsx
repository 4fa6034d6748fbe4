import { Redirect, Slot, usePathname } from 'expo-router';
import { useDeferredValue } from 'react';
import { can } from '@/features/access/permissions';
import { useMeQuery } from '@/features/auth/api/get-me';
import { signedOutOnThisDevice } from '@/features/auth/return-to';
import { DeviceGate } from '@/features/offline/components/device-gate';
import { ScreeningSync } from '@/features/screening/components/screening-sync';
import { ActiveClubProvider, useActiveClub } from '@/features/session/active-club';
import { TrainingSync } from '@/features/training/components/training-sync';
import { AppShell } from './app-shell';
import { FullScreenMessage } from './full-screen-message';
import { ShellFrame } from './shell-frame';

/**
 * The signed-in pages around each screen: the session, the club, the device's store, the bars. Its own
 * chunk, loaded by the signed-in layout (app/(club)/_layout.tsx): Expo Router loads every layout on
 * every page, the sign-in page included, and this part is only needed once someone is signed in.
 */
export default function ClubShell() {
  const live = useMeQuery();
  // The session's answer re-renders the whole signed-in page (bars, club, screen). Deferred, React renders
  // it in the background, yielding to the browser every few milliseconds, instead of in one long task
  // (our measurement: a 0.1 s task on a tester's home). Only values that keep their identity while
  // unchanged are deferred (the cached answer, a flag), so moving between screens renders nothing twice.
  const data = useDeferredValue(live.data);
  const isPending = useDeferredValue(live.isPending);
  const me = { data, isPending, error: live.error };
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
  return can(membership.role, 'screening.write') ? (
    <>
      <ScreeningSync />
      <TrainingSync />
    </>
  ) : null;
}
