// The sheet's line wording (our choice: the parts are the result screen's words, put on one line each).
import { describe, expect, it } from 'vitest';
import { getExercise } from '@/features/screening/engine/exercises';
import { detailLine, doseGroups, doseLine, sharedDetail } from './lines';

const leg = getExercise('side-lying-hip-abduction').prescription;

describe('training sheet lines', () => {
  it('puts sets and dose on one line, and tempo, rest and days a week on another', () => {
    expect(doseLine({ ...leg, sets: { min: 2, max: 3 }, dose: { kind: 'reps', min: 10, max: 15, perSide: true, toNearFatigue: false } })).toBe(
      '2-3 sets × 10-15 reps per side',
    );
    expect(doseLine({ ...leg, sets: { min: 1, max: 1 }, dose: { kind: 'seconds', min: 20, max: 30, perSide: false } })).toBe('1 set × 20-30 s');
    expect(detailLine({ ...leg, tempo: '2 s up, 2 s down', restSeconds: 45, perWeek: 3 })).toBe('Tempo 2 s up, 2 s down · 45 s rest · 3 times a week');
    expect(detailLine({ ...leg, tempo: '', restSeconds: 120, perWeek: 1 })).toBe('2 min rest · once a week');
  });

  it('says the detail once when every athlete shares it, and not at all when they differ', () => {
    const same = [{ prescription: leg }, { prescription: { ...leg, sets: { min: 1, max: 1 } } }];
    expect(sharedDetail(same)).toBe(detailLine(leg));
    expect(sharedDetail([...same, { prescription: { ...leg, perWeek: 2 } }])).toBeNull();
  });

  it('gathers the athletes who do the same, says each dose once, and puts those on hold last', () => {
    const line = (name: string, over: Partial<typeof leg> = {}, more: { adjustments?: string[]; held?: boolean } = {}) => ({
      name,
      prescription: { ...leg, ...over },
      adjustments: more.adjustments ?? [],
      held: more.held ?? false,
    });
    const cut = ['Sets cut to 2 in the growth-spurt window.'];
    const groups = doseGroups([
      line('Ana'),
      line('Ben', { sets: { min: 1, max: 1 } }, { held: true }),
      line('Cai', { sets: { min: 2, max: 2 } }, { adjustments: cut }),
      line('Dan'),
      line('Eve', { sets: { min: 2, max: 2 } }, { adjustments: cut }),
    ]);
    expect(groups.map((g) => [g.held, g.dose, g.adjustments, g.entries.map((e) => e.name)])).toEqual([
      [false, doseLine(leg), [], ['Ana', 'Dan']],
      [false, doseLine({ ...leg, sets: { min: 2, max: 2 } }), cut, ['Cai', 'Eve']],
      [true, '', [], ['Ben']],
    ]);
    expect(groups[0]!.load).toBe('Bodyweight');
    // The same dose with another rest is another group.
    expect(doseGroups([line('Ana'), line('Dan', { restSeconds: 90 })])).toHaveLength(2);
    expect(doseGroups([])).toEqual([]);
  });
});
