import { describe, expect, it } from 'vitest';
import { deepEqual, mergeDrafts } from './merge';

// The rule (our design): this phone's edits since its last confirmed save win field by field; all else
// comes from the server's newer draft.
describe('mergeDrafts', () => {
  it.each([
    ['nothing changed here: the server wins', { a: 1 }, { a: 1 }, { a: 2 }, { a: 2 }],
    ['nothing changed there: this phone wins', { a: 1 }, { a: 3 }, { a: 1 }, { a: 3 }],
    ['both changed the same field: this phone wins', { a: 1 }, { a: 3 }, { a: 2 }, { a: 3 }],
    ['different fields: both kept', { a: 1, b: 1 }, { a: 3, b: 1 }, { a: 1, b: 4 }, { a: 3, b: 4 }],
    ['a field only the server added is kept', { a: 1 }, { a: 3 }, { a: 1, c: 5 }, { a: 3, c: 5 }],
    ['ticks merge as sets', { criteria: ['x', 'y'] }, { criteria: ['x', 'y', 'z'] }, { criteria: ['y', 'w'] }, { criteria: ['y', 'w', 'z'] }],
    ['an untick here removes it from the server list', { criteria: ['x', 'y'] }, { criteria: ['y'] }, { criteria: ['x', 'y', 'w'] }, { criteria: ['y', 'w'] }],
    ['a point is one value', { p: { x: 1, y: 1 } }, { p: { x: 2, y: 1 } }, { p: { x: 1, y: 9 } }, { p: { x: 2, y: 1 } }],
    [
      'nested tasks merge per task',
      { tasks: { a: { notes: '' }, b: { notes: '' } } },
      { tasks: { a: { notes: 'mine' }, b: { notes: '' } } },
      { tasks: { a: { notes: '' }, b: { notes: 'theirs' } } },
      { tasks: { a: { notes: 'mine' }, b: { notes: 'theirs' } } },
    ],
  ])('%s', (_name, base, local, server, expected) => {
    expect(mergeDrafts<unknown>(base, local, server)).toEqual(expected);
  });

  it('treats missing and undefined keys alike', () => {
    expect(deepEqual({ a: 1, b: undefined }, { a: 1 })).toBe(true);
  });
});
