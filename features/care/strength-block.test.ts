import { describe, expect, it } from 'vitest';
import { isLoadedStrength, splitByBlock, strengthBlock } from './strength-block';

const RESULT_AT = '2026-09-14T16:30:00.000Z';
const ready = { status: 'ready' as const };
const needsClearance = { status: 'clearance-needed' as const };

describe('strengthBlock (our choice: refer on, or clearance needed without a later clearance, holds loaded strength and landing work)', () => {
  it.each([
    ['no clearance, ready plan', ready, null, false, null],
    ['referred, ready plan', ready, { status: 'referred' as const, setAt: '2026-09-15T00:00:00.000Z' }, true, 'referred'],
    ['clearance needed, none recorded', needsClearance, null, true, 'clearance-needed'],
    [
      'clearance needed, cleared before the result',
      needsClearance,
      { status: 'cleared' as const, setAt: '2026-09-01T00:00:00.000Z' },
      true,
      'clearance-needed',
    ],
    ['clearance needed, cleared after the result', needsClearance, { status: 'cleared' as const, setAt: '2026-09-20T00:00:00.000Z' }, false, null],
    ['clearance needed, modified after the result', needsClearance, { status: 'modified' as const, setAt: '2026-09-20T00:00:00.000Z' }, false, null],
    ['clearance needed, referred after the result', needsClearance, { status: 'referred' as const, setAt: '2026-09-20T00:00:00.000Z' }, true, 'referred'],
  ])('%s', (_name, plan, clearance, blocked, reason) => {
    const block = strengthBlock(plan, clearance, RESULT_AT);
    expect(block.blocked).toBe(blocked);
    if (block.blocked) expect(block.reason).toBe(reason);
  });
});

describe('splitByBlock', () => {
  const bodyweight = { name: 'bridge', phase: 'activation', prescription: { load: { kind: 'bodyweight' } } };
  const loaded = { name: 'split squat', phase: 'control', prescription: { load: { kind: 'percent-1rm' } } };
  const strengthPhase = { name: 'step-up', phase: 'strength', prescription: { load: { kind: 'bodyweight' } } };

  it('marks 1RM-based and strength-phase work as loaded strength work', () => {
    expect([bodyweight, loaded, strengthPhase].map(isLoadedStrength)).toEqual([false, true, true]);
  });

  const landing = { name: 'snap-down', phase: 'control', isJump: true, prescription: { load: { kind: 'bodyweight' } } };

  it('holds back loaded strength work and landing work when blocked, and nothing otherwise', () => {
    const all = [bodyweight, loaded, strengthPhase, landing];
    expect(splitByBlock(all, { blocked: false })).toEqual({ now: all, held: [] });
    const split = splitByBlock(all, strengthBlock(needsClearance, null, RESULT_AT));
    expect(split.now.map((e) => e.name)).toEqual(['bridge']);
    expect(split.held.map((e) => e.name)).toEqual(['split squat', 'step-up', 'snap-down']);
  });

  // our choice: "train with changes" holds back only what the physiotherapist ticked, until a new clearance.
  it('"train with changes" holds back the kinds ticked, and nothing when none is', () => {
    const all = [bodyweight, loaded, strengthPhase, landing];
    const changes = (holds: ('loaded' | 'landing')[]) => strengthBlock(ready, { status: 'modified', setAt: '2026-09-15T00:00:00.000Z', holds }, RESULT_AT);
    const landingOnly = changes(['landing']);
    expect(landingOnly).toMatchObject({ blocked: true, reason: 'changes', holds: ['landing'] });
    expect(landingOnly.blocked && landingOnly.words).toBe("Jump and landing work is on hold on the physiotherapist's advice, until a new clearance.");
    expect(splitByBlock(all, landingOnly).held.map((e) => e.name)).toEqual(['snap-down']);
    expect(splitByBlock(all, changes(['loaded'])).held.map((e) => e.name)).toEqual(['split squat', 'step-up']);
    expect(splitByBlock(all, changes(['loaded', 'landing'])).now.map((e) => e.name)).toEqual(['bridge']);
    expect(changes([])).toEqual({ blocked: false });
    // Pain reported and not cleared since the result: both kinds wait, whatever an older decision ticked.
    expect(strengthBlock(needsClearance, { status: 'modified', setAt: '2026-09-01T00:00:00.000Z', holds: ['landing'] }, RESULT_AT)).toMatchObject({
      reason: 'clearance-needed',
      holds: ['loaded', 'landing'],
    });
    // A ticked hold on an older decision left on a later "train as normal" does nothing.
    expect(strengthBlock(ready, { status: 'cleared', setAt: '2026-09-15T00:00:00.000Z', holds: ['landing'] }, RESULT_AT)).toEqual({ blocked: false });
  });

  it('a referral holds landing work too: a child referred for pain after jumps does no landings', () => {
    const split = splitByBlock([bodyweight, landing], strengthBlock(ready, { status: 'referred', setAt: '2026-09-15T00:00:00.000Z' }, RESULT_AT));
    expect(split.now.map((e) => e.name)).toEqual(['bridge']);
    expect(split.held.map((e) => e.name)).toEqual(['snap-down']);
  });
});
