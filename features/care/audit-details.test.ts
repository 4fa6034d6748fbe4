import { describe, expect, it } from 'vitest';
import { auditDetailsInWords } from './audit-details';

// Our choice: what the on-screen trail shows of an event's details.
describe('auditDetailsInWords', () => {
  it.each([
    [{ status: 'modified', detail: 'No deep squats for two weeks' }, 'decision: Train with changes · note: No deep squats for two weeks'],
    [{ releaseId: 'a1', update: 'clearance', clearanceId: 'c1', replaces: 'r0', emailed: false }, 'changed by: clearance · e-mailed: no'],
    [{ count: 3, visibilities: ['team', 'family'] }, 'notes read: 3 · shared with: Team only, Shared with family'],
    [{ previousText: 'old words', before: { a: 1 }, after: { a: 2 } }, ''],
    [{ to: 'parent@example.test', subject: 'Summary', releaseId: 'x' }, 'to: parent@example.test · subject: Summary'],
    [{ somethingNew: 7, nested: { a: 1 } }, 'somethingNew: 7'],
  ])('%j reads "%s"', (detail, words) => {
    expect(auditDetailsInWords(detail)).toBe(words);
  });
});
