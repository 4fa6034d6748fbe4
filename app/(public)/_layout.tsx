import { Redirect, Slot, usePathname } from 'expo-router';
import { useMeQuery } from '@/features/auth/api/get-me';
import { FullScreenMessage } from '@/features/shell/components/full-screen-message';

export default function PublicLayout() {
  const me = useMeQuery();
  const path = usePathname();
  if (me.isPending) return <FullScreenMessage busy />;
  // Invitation and reset links stay usable even when someone is signed in on this device.
  if (me.data && path === '/sign-in') return <Redirect href="/" />;
  return <Slot />;
}
