import { Redirect, Slot, usePathname } from 'expo-router';
import { useMeQuery } from '@/features/auth/api/get-me';

export default function PublicLayout() {
  const me = useMeQuery();
  const path = usePathname();
  // The signed-out screens render at once; someone already signed in is sent home when /api/me answers.
  // Invitation and reset links stay usable even when someone is signed in on this device.
  if (me.data && path === '/sign-in') return <Redirect href="/" />;
  return <Slot />;
}
