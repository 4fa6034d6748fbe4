import { describe, expect, it } from 'vitest';
import type { OutboxEntry, OutboxState } from './outbox';
import { syncStatusDetail, syncStatusOf, syncStatusText } from './sync-status';

const entry = (seq: number, state: OutboxEntry['state'] = 'waiting', assessmentId = 'a'): OutboxEntry => ({
  seq,
  key: `k${seq}`,
  kind: 'draft',
  assessmentId,
  clubId: 'c',
  userId: 'u',
  createdAt: '',
  attempts: 0,
  state,
});
const st = (entries: OutboxEntry[], sending: number | null = null, lastError: OutboxState['lastError'] = null): OutboxState => ({
  entries,
  sending,
  lastError,
});

describe('sync status', () => {
  it.each([
    [true, st([]), 'All saved'],
    [false, st([]), 'Offline'],
    [false, st([entry(1), entry(2), entry(3)]), 'Offline · 3 waiting'],
    [false, st([entry(1)]), 'Offline · 1 waiting'],
    [true, st([entry(1), entry(2)], 1), 'Syncing · 2 left'],
    [true, st([entry(1)], null, { status: 0, code: 'offline', message: 'x' }), 'Retrying · 1 waiting'],
    [true, st([entry(1, 'refused'), entry(2)]), '1 refused'],
  ])('online %s with %j reads "%s"', (online, state, text) => {
    expect(syncStatusText(syncStatusOf(online, state))).toBe(text);
  });

  // Our wording: a change sent straight to the server (a photo, a note) is not "saved" until it has arrived.
  it('says "Saving…" while a change is on its way and nothing waits, and what waits or is refused first', () => {
    expect(syncStatusText(syncStatusOf(true, st([]), true))).toBe('Saving…');
    expect(syncStatusDetail(syncStatusOf(true, st([]), true))).toBe('Sending a change to the server.');
    expect(syncStatusText(syncStatusOf(true, st([entry(1)]), true))).toBe('Online · 1 waiting');
    expect(syncStatusText(syncStatusOf(false, st([]), true))).toBe('Offline');
  });

  it("counts the athletes' screens the changes belong to, offline (our wording)", () => {
    const three = st([entry(1), entry(2, 'waiting', 'b'), entry(3, 'waiting', 'b'), entry(4, 'waiting', 'c')]);
    expect(syncStatusDetail(syncStatusOf(false, three))).toBe(
      "No connection. 4 changes to 3 athletes' screens are kept on this phone and will be sent in order when the connection is back.",
    );
    expect(syncStatusDetail(syncStatusOf(false, st([entry(1)])))).toBe(
      "No connection. 1 change to one athlete's screen is kept on this phone and will be sent in order when the connection is back.",
    );
  });
});
