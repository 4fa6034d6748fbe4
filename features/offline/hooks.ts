import { useEffect, useState, useSyncExternalStore } from 'react';
import { connectivity, outbox, photoBytesOnDevice } from './device';
import { syncStatusOf, type SyncStatus } from './sync-status';

export function useOnline(): boolean {
  return useSyncExternalStore(connectivity.subscribe, connectivity.isOnline, connectivity.isOnline);
}

export function useOutboxState() {
  return useSyncExternalStore(outbox.subscribe, outbox.getState, outbox.getState);
}

/** Online, offline with N waiting, syncing, or all saved. */
export function useSyncStatus(): SyncStatus {
  const online = useOnline();
  const state = useOutboxState();
  return syncStatusOf(online, state);
}

/** Bytes of photos kept on the device, re-read whenever the queue changes. */
export function usePhotoBytesOnDevice(): number {
  const state = useOutboxState();
  const [bytes, setBytes] = useState(0);
  useEffect(() => {
    let live = true;
    void photoBytesOnDevice()
      .then((b) => live && setBytes(b))
      .catch(() => undefined);
    return () => {
      live = false;
    };
  }, [state]);
  return bytes;
}
