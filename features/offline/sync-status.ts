// The one status shown on every screen: is this device online, and is everything on the server? Pure.
// Types only: this module is in every screen's first chunk, the outbox's code is not.
import type { OutboxState } from './outbox';

export type SyncStatus =
  | { kind: 'saved' }
  | { kind: 'sending' }
  | { kind: 'offline'; waiting: number; athletes: number }
  | { kind: 'syncing'; waiting: number }
  | { kind: 'online'; waiting: number; retrying: boolean }
  | { kind: 'attention'; refused: number; waiting: number };

/** `sending`: a request that changes something is on its way (straight to the server, not through the outbox). */
export function syncStatusOf(online: boolean, outbox: OutboxState, sending = false): SyncStatus {
  const refused = outbox.entries.filter((e) => e.state === 'refused').length;
  const waiting = outbox.entries.length - refused;
  if (!online) {
    // One athlete's screen is many changes (each save, each photo, the submit): the sentence counts both.
    const athletes = new Set(outbox.entries.flatMap((e) => (e.kind === 'attendance' ? [] : [e.assessmentId]))).size;
    return { kind: 'offline', waiting: outbox.entries.length, athletes };
  }
  if (refused > 0) return { kind: 'attention', refused, waiting };
  if (outbox.sending !== null) return { kind: 'syncing', waiting };
  if (waiting > 0) return { kind: 'online', waiting, retrying: outbox.lastError !== null };
  // Not "All saved" while a photo or a save is still on its way: the screen said "Saving…" beside it.
  if (sending) return { kind: 'sending' };
  return { kind: 'saved' };
}

const changes = (n: number) => (n === 1 ? '1 change' : `${n} changes`);
const forAthletes = (n: number) => (n === 0 ? '' : n === 1 ? " to one athlete's screen" : ` to ${n} athletes' screens`);

/** Short words for the status pill (it shares a phone's top bar with the menu). */
export function syncStatusText(s: SyncStatus): string {
  switch (s.kind) {
    case 'saved':
      return 'All saved';
    case 'sending':
      return 'Saving…';
    case 'offline':
      return s.waiting === 0 ? 'Offline' : `Offline · ${s.waiting} waiting`;
    case 'syncing':
      return `Syncing · ${s.waiting} left`;
    case 'online':
      return s.retrying ? `Retrying · ${s.waiting} waiting` : `Online · ${s.waiting} waiting`;
    case 'attention':
      return `${s.refused} refused`;
  }
}

/** The sentence under the pill when it is opened. */
export function syncStatusDetail(s: SyncStatus): string {
  switch (s.kind) {
    case 'saved':
      return 'The server has everything done on this phone.';
    case 'sending':
      return 'Sending a change to the server.';
    case 'offline':
      return s.waiting === 0
        ? 'No connection. You can keep screening: changes are kept on this phone and sent when the connection is back.'
        : `No connection. ${changes(s.waiting)}${forAthletes(s.athletes)} ${s.waiting === 1 ? 'is' : 'are'} kept on this phone and will be sent in order when the connection is back.`;
    case 'syncing':
      return 'Sending what was done on this phone, oldest first.';
    case 'online':
      return s.retrying ? 'The last try did not get through. Trying again shortly.' : 'Waiting to send.';
    case 'attention':
      return 'The server refused some changes. They are kept on this phone; each says why below.';
  }
}
