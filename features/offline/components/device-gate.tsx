import { startTransition, useEffect, useState, type ReactNode } from 'react';
import { can } from '@/features/access/permissions';
import { useActiveClub } from '@/features/session/active-club';
import { ShellFrame } from '@/features/shell/components/shell-frame';
import { deviceDataMayExist, setDeviceSession, startDevice } from '../device-handle';

/**
 * Opens the device's store for the signed-in person. For people who screen, before the screens render,
 * so a draft kept on the device is read before the screen seeds its working copy from the server
 * (nothing typed is lost). People who do not screen keep nothing: their screens render at once, and
 * the store is loaded only when this browser holds someone's device data (it is removed then, see
 * `startDevice`).
 */
export function DeviceGate({ children }: { children: ReactNode }) {
  const { me, membership } = useActiveClub();
  const userId = me.user.id;
  const screens = can(membership.role, 'screening.write');
  setDeviceSession({ userId, clubId: membership.clubId });
  const key = `${userId}:${screens}`;
  const [readyFor, setReadyFor] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    const open = async () => {
      if (screens || (await deviceDataMayExist())) await startDevice(userId);
    };
    // In a transition, so React draws the screens in slices instead of one long task (0.2 s on a 4x
    // slower CPU, our measurement); the frame stays until they are all drawn.
    void open()
      .catch(() => undefined)
      .finally(() => live && startTransition(() => setReadyFor(key)));
    return () => {
      live = false;
    };
  }, [key, userId, screens]);
  // Loading and reading the device takes a moment: the frame stays meanwhile for those who screen.
  if (screens && readyFor !== key) return <ShellFrame />;
  return <>{children}</>;
}
