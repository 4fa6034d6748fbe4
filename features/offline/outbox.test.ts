import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { Outbox, RETRY_DELAYS_MS, waitedOnPhone, WAITED_MS, type OutboxEntry, type OutboxStorage } from './outbox';

function memoryStorage(initial: OutboxEntry[] = []): OutboxStorage & { rows: Map<number, OutboxEntry> } {
  const rows = new Map<number, OutboxEntry>(initial.map((e) => [e.seq, e]));
  let seq = Math.max(0, ...initial.map((e) => e.seq));
  return {
    rows,
    all: async () => [...rows.values()].map((e) => structuredClone(e)),
    add: async (e) => {
      seq += 1;
      const stored = { ...e, seq };
      rows.set(seq, structuredClone(stored));
      return stored;
    },
    put: async (e) => void rows.set(e.seq, structuredClone(e)),
    remove: async (s) => void rows.delete(s),
  };
}

const fail = (status: number, code = 'x') => Object.assign(new Error(`HTTP ${status}`), { status, code });
const base = { clubId: 'c1', userId: 'u1' };

function setup(opts: { online?: () => boolean; send?: (e: OutboxEntry) => Promise<void>; storage?: ReturnType<typeof memoryStorage> } = {}) {
  const storage = opts.storage ?? memoryStorage();
  const sent: { seq: number; kind: string; assessmentId: string; key: string }[] = [];
  let n = 0;
  const send = vi.fn(
    opts.send ??
      (async (e: OutboxEntry) => {
        sent.push({ seq: e.seq, kind: e.kind, assessmentId: e.kind === 'attendance' ? e.squadId : e.assessmentId, key: e.key });
      }),
  );
  const outbox = new Outbox({ storage, send, isOnline: opts.online ?? (() => true), newKey: () => `key-${++n}` });
  outbox.setUser('u1');
  return { outbox, storage, send, sent };
}

async function settle() {
  for (let i = 0; i < 20; i += 1) await Promise.resolve();
}

describe('Outbox', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  it('sends changes oldest first, one at a time, each with its own idempotency key', async () => {
    let online = false;
    const { outbox, sent } = setup({ online: () => online });
    await outbox.addDraft({ ...base, assessmentId: 'a1' });
    await outbox.add({ ...base, kind: 'photo', assessmentId: 'a1' });
    await outbox.add({ ...base, kind: 'submit', assessmentId: 'a1' });
    await outbox.addDraft({ ...base, assessmentId: 'a2' });
    expect(sent).toEqual([]);
    online = true;
    outbox.kick();
    await vi.runAllTimersAsync();
    expect(sent.map((s) => `${s.kind}:${s.assessmentId}`)).toEqual(['draft:a1', 'photo:a1', 'submit:a1', 'draft:a2']);
    expect(new Set(sent.map((s) => s.key)).size).toBe(4);
    expect(outbox.getState().entries).toEqual([]);
  });

  it('one draft entry carries every edit: a second save request joins the waiting one', async () => {
    const { outbox, storage } = setup({ online: () => false });
    const a = await outbox.addDraft({ ...base, assessmentId: 'a1' });
    const b = await outbox.addDraft({ ...base, assessmentId: 'a1' });
    expect(b.seq).toBe(a.seq);
    // ...but not across a submit: the edits after it need their own save.
    await outbox.add({ ...base, kind: 'submit', assessmentId: 'a1' });
    const c = await outbox.addDraft({ ...base, assessmentId: 'a1' });
    expect(c.seq).not.toBe(a.seq);
    expect(storage.rows.size).toBe(3);
  });

  it('retries a lost connection with back-off, keeping the same key, and never skips ahead', async () => {
    let calls = 0;
    const keys: string[] = [];
    const order: string[] = [];
    const { outbox } = setup({
      send: async (e) => {
        calls += 1;
        keys.push(e.key);
        order.push(e.kind);
        if (calls <= 2) throw fail(0, 'offline');
      },
    });
    await outbox.add({ ...base, kind: 'photo', assessmentId: 'a1' });
    await outbox.add({ ...base, kind: 'submit', assessmentId: 'a1' });
    await settle();
    expect(order).toEqual(['photo']);
    expect(outbox.getState().lastError).toMatchObject({ status: 0 });
    await vi.advanceTimersByTimeAsync(RETRY_DELAYS_MS[0] - 1);
    expect(calls).toBe(1);
    await vi.advanceTimersByTimeAsync(1);
    expect(calls).toBe(2);
    await vi.advanceTimersByTimeAsync(RETRY_DELAYS_MS[1]);
    expect(order).toEqual(['photo', 'photo', 'photo', 'submit']);
    expect(keys[0]).toBe(keys[1]);
    expect(keys[1]).toBe(keys[2]);
    expect(outbox.getState().entries).toEqual([]);
  });

  it.each([
    [0, true],
    [401, true],
    [408, true],
    [429, true],
    [500, true],
    [503, true],
    [400, false],
    [403, false],
    [404, false],
    [413, false],
  ])('an answer of %i is retried: %s', async (status, retried) => {
    let calls = 0;
    const { outbox } = setup({
      send: async () => {
        calls += 1;
        if (calls === 1) throw fail(status);
      },
    });
    await outbox.add({ ...base, kind: 'photo', assessmentId: 'a1' });
    await vi.advanceTimersByTimeAsync(RETRY_DELAYS_MS[0]);
    expect(calls).toBe(retried ? 2 : 1);
    expect(outbox.getState().entries.map((e) => e.state)).toEqual(retried ? [] : ['refused']);
  });

  it('a refused draft holds back the submit of the same assessment, not the others', async () => {
    const { outbox, sent } = setup({
      send: async (e) => {
        if (e.kind === 'draft' && e.assessmentId === 'a1') throw fail(400, 'invalid_input');
        sent.push({ seq: e.seq, kind: e.kind, assessmentId: e.kind === 'attendance' ? e.squadId : e.assessmentId, key: e.key });
      },
    });
    await outbox.addDraft({ ...base, assessmentId: 'a1' });
    await outbox.add({ ...base, kind: 'submit', assessmentId: 'a1' });
    await outbox.add({ ...base, kind: 'submit', assessmentId: 'a2' });
    await vi.runAllTimersAsync();
    expect(sent.map((s) => `${s.kind}:${s.assessmentId}`)).toEqual(['submit:a2']);
    expect(outbox.getState().entries.map((e) => `${e.kind}:${e.state}`)).toEqual(['draft:refused', 'submit:waiting']);
  });

  it('a refused photo does not hold back the submit, and can be sent again with a new key', async () => {
    let refuse = true;
    const { outbox, sent } = setup({
      send: async (e) => {
        if (e.kind === 'photo' && refuse) throw fail(413, 'too_large');
        sent.push({ seq: e.seq, kind: e.kind, assessmentId: e.kind === 'attendance' ? e.squadId : e.assessmentId, key: e.key });
      },
    });
    const photo = await outbox.add({ ...base, kind: 'photo', assessmentId: 'a1' });
    await outbox.add({ ...base, kind: 'submit', assessmentId: 'a1' });
    await vi.runAllTimersAsync();
    expect(sent.map((s) => s.kind)).toEqual(['submit']);
    refuse = false;
    await outbox.sendAgain(photo.seq);
    await vi.runAllTimersAsync();
    expect(sent.map((s) => s.kind)).toEqual(['submit', 'photo']);
    expect(sent[1]!.key).not.toBe(photo.key);
  });

  it('survives a reload: the queue is read back from the device, attempts and keys included', async () => {
    const storage = memoryStorage();
    const first = setup({ storage, send: async () => Promise.reject(fail(0)) });
    await first.outbox.add({ ...base, kind: 'photo', assessmentId: 'a1' });
    await first.outbox.add({ ...base, kind: 'submit', assessmentId: 'a1' });
    await settle();
    const [photo] = [...storage.rows.values()];
    expect(photo).toMatchObject({ attempts: 1, key: 'key-1' });
    first.outbox.reset();

    const second = setup({ storage });
    await second.outbox.load();
    second.outbox.kick();
    await vi.runAllTimersAsync();
    expect(second.sent.map((s) => `${s.kind}:${s.key}`)).toEqual(['photo:key-1', 'submit:key-2']);
    expect(storage.rows.size).toBe(0);
  });

  it("sends only the signed-in person's changes", async () => {
    const { outbox, sent } = setup();
    outbox.setUser('someone-else');
    await outbox.add({ ...base, kind: 'submit', assessmentId: 'a1' });
    await vi.runAllTimersAsync();
    expect(sent).toEqual([]);
    outbox.setUser('u1');
    await vi.runAllTimersAsync();
    expect(sent).toHaveLength(1);
  });

  it('keeps the words of the fields a refusal names, not the general line', async () => {
    const { outbox } = setup({
      send: async () => {
        throw Object.assign(new Error('Some fields need attention.'), {
          status: 400,
          code: 'validation_failed',
          fields: { athleteIds: 'Some of these athletes are not in this squad any more: open the sheet again.' },
        });
      },
    });
    await outbox.add({ ...base, kind: 'submit', assessmentId: 'a1' });
    await vi.runAllTimersAsync();
    expect(outbox.getState().entries[0]).toMatchObject({
      state: 'refused',
      error: { status: 400, code: 'validation_failed', message: 'Some of these athletes are not in this squad any more: open the sheet again.' },
    });
  });

  it('whenDone resolves when the entry is on the server and rejects when it is refused', async () => {
    const { outbox } = setup({
      send: async (e) => {
        if (e.kind === 'photo') throw fail(415, 'not_a_photo');
      },
    });
    const submit = await outbox.add({ ...base, kind: 'submit', assessmentId: 'a2' });
    const photo = await outbox.add({ ...base, kind: 'photo', assessmentId: 'a1' });
    const done = outbox.whenDone(submit.seq);
    const refused = outbox.whenDone(photo.seq).then(
      () => 'sent',
      (e: unknown) => e,
    );
    await vi.runAllTimersAsync();
    await expect(done).resolves.toBeUndefined();
    expect(await refused).toMatchObject({ status: 415 });
  });

  describe('records of who took part', () => {
    const day = (heldOn: string, athleteIds: string[]) => ({ heldOn, athleteIds, note: '' });

    it('carry their record whole and go out in order with the rest', async () => {
      let online = false;
      const bodies: unknown[] = [];
      const order: string[] = [];
      const { outbox } = setup({
        online: () => online,
        send: async (e) => {
          order.push(e.kind);
          if (e.kind === 'attendance') bodies.push(e.record);
        },
      });
      await outbox.addDraft({ ...base, assessmentId: 'a1' });
      await outbox.addAttendance({ ...base, squadId: 's1', record: day('2026-12-01', ['x', 'y']) });
      expect(outbox.getState().entries.map((e) => e.kind)).toEqual(['draft', 'attendance']);
      online = true;
      outbox.kick();
      await vi.runAllTimersAsync();
      expect(order).toEqual(['draft', 'attendance']);
      expect(bodies).toEqual([day('2026-12-01', ['x', 'y'])]);
      expect(outbox.getState().entries).toEqual([]);
    });

    it("a later record of the same squad's day replaces the one still waiting; other days and squads stay", async () => {
      const { outbox, storage } = setup({ online: () => false });
      await outbox.addAttendance({ ...base, squadId: 's1', record: day('2026-12-01', ['x']) });
      await outbox.addAttendance({ ...base, squadId: 's1', record: day('2026-11-30', ['x']) });
      await outbox.addAttendance({ ...base, squadId: 's2', record: day('2026-12-01', ['z']) });
      await outbox.addAttendance({ ...base, squadId: 's1', record: day('2026-12-01', ['x', 'y']) });
      const left = outbox
        .getState()
        .entries.map((e) => (e.kind === 'attendance' ? `${e.squadId}:${e.record.heldOn}:${e.record.athleteIds.join('+')}` : e.kind));
      expect(left).toEqual(['s1:2026-11-30:x', 's2:2026-12-01:z', 's1:2026-12-01:x+y']);
      expect(storage.rows.size).toBe(3);
    });

    it('a record that reached the server directly removes the waiting one of that day, never the one being sent', async () => {
      let release: () => void = () => undefined;
      const { outbox } = setup({
        send: (e) => (e.kind === 'attendance' && e.record.heldOn === '2026-12-01' ? new Promise<void>((r) => (release = r)) : Promise.resolve()),
      });
      outbox.setUser(null); // hold the queue
      await outbox.addAttendance({ ...base, squadId: 's1', record: day('2026-12-02', ['x']) });
      await outbox.supersedeAttendance('s1', '2026-12-02');
      expect(outbox.getState().entries).toEqual([]);

      await outbox.addAttendance({ ...base, squadId: 's1', record: day('2026-12-01', ['x']) });
      outbox.setUser('u1');
      await settle();
      expect(outbox.getState().sending).not.toBeNull();
      await outbox.supersedeAttendance('s1', '2026-12-01');
      expect(outbox.getState().entries).toHaveLength(1);
      release();
      await vi.runAllTimersAsync();
      expect(outbox.getState().entries).toEqual([]);
    });

    it('are not held back by a refused draft', async () => {
      const { outbox } = setup({
        send: async (e) => {
          if (e.kind === 'draft') throw fail(400, 'invalid');
        },
      });
      await outbox.addDraft({ ...base, assessmentId: 'a1' });
      await outbox.addAttendance({ ...base, squadId: 's1', record: day('2026-12-01', ['x']) });
      await vi.runAllTimersAsync();
      expect(outbox.getState().entries.map((e) => `${e.kind}:${e.state}`)).toEqual(['draft:refused']);
    });
  });

  it('two tabs on one queue send each entry once: one at a time, each turn reading the queue back (our choice)', async () => {
    let online = false;
    const storage = memoryStorage();
    // A photo's blob leaves storage with its entry: a second send of it would be refused ("no longer on this phone").
    const sentTimes = new Map<number, number>();
    const send = async (e: OutboxEntry) => {
      if (!storage.rows.has(e.seq)) throw fail(400, 'photo_missing');
      sentTimes.set(e.seq, (sentTimes.get(e.seq) ?? 0) + 1);
      await new Promise((r) => setTimeout(r, 10));
    };
    // The Web Locks stand-in: one holder at a time, the others queue.
    let chain = Promise.resolve();
    const exclusive = (fn: () => Promise<void>) => {
      const turn = chain.then(fn);
      chain = turn.catch(() => undefined);
      return turn;
    };
    const tab = () => new Outbox({ storage, send, isOnline: () => online, newKey: () => crypto.randomUUID(), exclusive });
    const a = tab();
    a.setUser('u1');
    await a.addDraft({ ...base, assessmentId: 'a1' });
    await a.add({ ...base, kind: 'photo', assessmentId: 'a1' });
    await a.add({ ...base, kind: 'submit', assessmentId: 'a1' });
    // The second tab opened with the three waiting.
    const b = tab();
    b.setUser('u1');
    await b.load();
    expect(b.getState().entries).toHaveLength(3);
    const waited = a.whenDone(3);
    online = true;
    a.kick();
    b.kick();
    await vi.runAllTimersAsync();
    await waited;
    expect([...sentTimes.entries()].sort()).toEqual([
      [1, 1],
      [2, 1],
      [3, 1],
    ]);
    expect(storage.rows.size).toBe(0);
    // Neither tab shows anything refused or waiting.
    expect(a.getState().entries).toEqual([]);
    expect(b.getState().entries).toEqual([]);
  });

  it('tells a change that waited on the phone from one that went straight out (our choice: made before the connection came back, more than one try, or 10 s)', () => {
    const at = Date.parse('2026-12-05T10:00:00.000Z');
    const created = '2026-12-05T10:00:00.000Z';
    expect(WAITED_MS).toBe(10_000);
    expect(waitedOnPhone({ attempts: 1, createdAt: created }, at + 2_000)).toBe(false);
    expect(waitedOnPhone({ attempts: 1, createdAt: created }, at + 10_001)).toBe(true);
    expect(waitedOnPhone({ attempts: 2, createdAt: created }, at + 500)).toBe(true);
    // Made before the connection came back: it waited, however soon it went.
    expect(waitedOnPhone({ attempts: 1, createdAt: created }, at + 2_000, at + 1_000)).toBe(true);
    expect(waitedOnPhone({ attempts: 1, createdAt: created }, at + 2_000, at - 1_000)).toBe(false);
  });
});
