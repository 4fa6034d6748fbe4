import { useEffect, useState, type ReactNode } from 'react';
import { useActiveClub } from '@/features/session/active-club';
import { setDeviceSession, startDevice } from '../device';

/**
 * Opens the device's store for the signed-in person before the screens render, so a draft kept on the
 * device is read before the screen seeds its working copy from the server (nothing typed is lost).
 */
export function DeviceGate({ children }: { children: ReactNode }) {
  const { me, membership } = useActiveClub();
  const userId = me.user.id;
  setDeviceSession({ userId, clubId: membership.clubId });
  const [readyFor, setReadyFor] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    void startDevice(userId).finally(() => live && setReadyFor(userId));
    return () => {
      live = false;
    };
  }, [userId]);
  // Reading the device takes a few milliseconds: nothing to show meanwhile.
  if (readyFor !== userId) return null;
  return <>{children}</>;
}
