import { describe, expect, it } from 'vitest';
import { safeCell, safeCsv } from './csv';

// Common practice, no source checked here: a CSV cell starting with = + - @ (or a tab or carriage return)
// is run as a formula by spreadsheets; written with a leading apostrophe it shows as text.
describe('CSV cells safe to open in a spreadsheet', () => {
  it('escapes text a spreadsheet would run, and leaves numbers and plain text', () => {
    expect(['=cmd Formula', '+1', '@SUM(A1)', '-x', '\t=1'].map(safeCell)).toEqual(["'=cmd Formula", "'+1", "'@SUM(A1)", "'-x", "'\t=1"]);
    expect(['-0.5', '12', 'Ana', '', 'O-Neil'].map(safeCell)).toEqual(['-0.5', '12', 'Ana', '', 'O-Neil']);
    expect([3, null, true].map(safeCell)).toEqual([3, null, true]);
  });
  it('writes the rows with the cells escaped', () => {
    expect(safeCsv([['=2+2', 'Kai']])).toBe("'=2+2,Kai\n");
  });
});
