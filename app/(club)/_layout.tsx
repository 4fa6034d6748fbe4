import { Navigator } from 'expo-router';
import { Suspense } from 'react';
import { ShellFrame } from '@/features/shell/components/shell-frame';
import { lazyNow } from '@/features/ui/lazy-now';

// Expo Router loads every layout before any page renders, the sign-in page's included; this one stays
// light and its signed-in part (session, club, device store, bars) is a chunk of its own, which every
// signed-in page's HTML names (server/dev/route-chunks.mjs) so it arrives with the page's own scripts.
const ClubShell = lazyNow(() => import('@/features/shell/components/club-shell'));

export default function ClubLayout() {
  // The navigator is mounted from the first render, before the session is known: it holds the address
  // the page was opened at (a layout that renders no navigator while it waits sends the router back
  // to the home route, and a slow answer lost a deep link).
  return (
    <Navigator>
      <Suspense fallback={<ShellFrame />}>
        <ClubShell />
      </Suspense>
    </Navigator>
  );
}
