import { useIsMutating } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { loadedDevice, useOnline, useOutboxState } from './device-handle';
import { syncStatusOf, type SyncStatus } from './sync-status';

export { useOnline, useOutboxState };

/** Online, offline with N waiting, syncing, or all saved. */
export function useSyncStatus(): SyncStatus {
  const online = useOnline();
  const state = useOutboxState();
  const sending = useIsMutating() > 0;
  return syncStatusOf(online, state, sending);
}

/** Bytes of photos kept on the device, re-read whenever the queue changes. */
export function usePhotoBytesOnDevice(): number {
  const state = useOutboxState();
  const [bytes, setBytes] = useState(0);
  useEffect(() => {
    let live = true;
    const device = loadedDevice();
    if (!device) return;
    void device
      .photoBytesOnDevice()
      .then((b) => live && setBytes(b))
      .catch(() => undefined);
    return () => {
      live = false;
    };
  }, [state]);
  return bytes;
}
