import { useScreeningSync } from '@/features/screening/hooks/use-screening-sync';

/** Sends screening's changes queued on this device, whatever screen is open. Renders nothing. */
export function ScreeningSync() {
  useScreeningSync();
  return null;
}
