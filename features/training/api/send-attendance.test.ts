import { QueryClient } from '@tanstack/react-query';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { AttendanceEntry } from '@/features/offline/outbox';
import { sendAttendance } from './send-attendance';

// A record kept on the phone and sent later: what the outbox keeps when the server refuses it.
const entry: AttendanceEntry = {
  seq: 1,
  key: 'key-123456789',
  kind: 'attendance',
  squadId: 'squad-1',
  clubId: 'club-1',
  userId: 'user-1',
  createdAt: '2026-12-04T10:00:00.000Z',
  attempts: 1,
  state: 'waiting',
  record: { heldOn: '2026-12-03', athleteIds: ['a1', 'a2'], note: '' },
};

function answer(status: number, body: unknown) {
  return vi.fn(async () => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } }));
}

describe('sending a record of who took part', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('posts the record with its idempotency key and club, then asks for the lists again', async () => {
    const fetch = answer(201, { session: { id: 's1' } });
    vi.stubGlobal('fetch', fetch);
    const client = new QueryClient();
    const invalidate = vi.spyOn(client, 'invalidateQueries');
    await sendAttendance(entry, client);
    const [url, init] = fetch.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/squads/squad-1/training-sessions');
    const headers = new Headers(init.headers);
    expect(headers.get('Idempotency-Key')).toBe('key-123456789');
    expect(headers.get('X-Club-Id')).toBe('club-1');
    expect(JSON.parse(String(init.body))).toEqual(entry.record);
    expect(invalidate.mock.calls.map(([f]) => f?.queryKey)).toEqual([
      ['training', 'club-1', 'sessions', 'squad-1'],
      ['progress', 'club-1'],
    ]);
  });

  it('passes a refusal on with the fields the server named (the outbox keeps their words)', async () => {
    const refusal = 'Some of these athletes are not in this squad any more: open the sheet again.';
    vi.stubGlobal('fetch', answer(400, { error: { code: 'validation_failed', message: 'Some fields need attention.', fields: { athleteIds: refusal } } }));
    await expect(sendAttendance(entry, new QueryClient())).rejects.toMatchObject({ status: 400, fields: { athleteIds: refusal } });
  });

  it('passes a lost connection on unchanged, so the outbox tries again', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => {
        throw new TypeError('Failed to fetch');
      }),
    );
    await expect(sendAttendance(entry, new QueryClient())).rejects.toMatchObject({ status: 0 });
  });
});
