import { Redirect, Slot, usePathname } from 'expo-router';
import { useMeQuery } from '@/features/auth/api/get-me';

export default function PublicLayout() {
  // The signed-out screens render at once. Only the leaf below waits for /api/me: when it answers, that
  // leaf renders again, not the whole screen (a Chromium profile of sign-in: the answer re-rendered the
  // form, a sixth of the page's start-up).
  return (
    <>
      <HomeWhenSignedIn />
      <Slot />
    </>
  );
}

/** Someone already signed in is sent home from sign-in. Invitation and reset links stay usable. */
function HomeWhenSignedIn() {
  const me = useMeQuery();
  const path = usePathname();
  return me.data && path === '/sign-in' ? <Redirect href="/" /> : null;
}
