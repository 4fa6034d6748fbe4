import { describe, expect, it } from 'vitest';
import { auditActionInWords, auditDateErrors, auditDetailsInWords, auditSubjectInWords } from './audit-details';

// Our choice: what the on-screen trail shows of an event's details.
describe('auditDetailsInWords', () => {
  it.each([
    [{ status: 'modified', detail: 'No deep squats for two weeks' }, 'decision: Train with changes · note: No deep squats for two weeks'],
    [{ status: 'modified', detail: '', holds: ['loaded', 'landing'] }, 'decision: Train with changes · on hold: loaded strength work, jump and landing work'],
    [{ releaseId: 'a1', update: 'clearance', clearanceId: 'c1', replaces: 'r0', emailed: false }, 'changed by: clearance · e-mailed: no'],
    [{ count: 3, visibilities: ['team', 'family'] }, 'notes read: 3 · shared with: Team only, Shared with family'],
    [{ previousText: 'old words', before: { a: 1 }, after: { a: 2 } }, ''],
    [{ previousText: 'old words', previousVisibility: 'family', visibility: 'team' }, 'was shared with: Shared with family · shared with: Team only'],
    [{ to: 'parent@example.test', subject: 'Summary', releaseId: 'x' }, 'to: parent@example.test · subject: Summary'],
    [{ somethingNew: 7, nested: { a: 1 } }, 'somethingNew: 7'],
    [{ kind: 'photos', granted: false, via: 'family page' }, 'about: photos · answer: no · through: family page'],
    [{ kind: 'email_summaries', via: 'unsubscribe link' }, 'about: e-mail summaries · through: unsubscribe link'],
    [{ fields: ['racketHand', 'squadId'] }, 'fields: racket hand, squad'],
    [
      { email: 'gran@example.test', role: 'parent', children: ['Kit Ames', 'Lou Berg'] },
      'e-mail: gran@example.test · role: Parent or guardian · children: Kit Ames, Lou Berg',
    ],
  ])('%j reads "%s"', (detail, words) => {
    expect(auditDetailsInWords(detail)).toBe(words);
  });
});

describe('audit actions and records in words', () => {
  it('names every action the server records, and shows an unknown code as stored', () => {
    expect(auditActionInWords('view')).toBe('viewed');
    expect(auditActionInWords('plan.change')).toBe('adjusted the plan of');
    expect(['invite', 'archive', 'restore'].map(auditActionInWords)).toEqual(['invited', 'archived', 'restored']);
    expect(auditActionInWords('something-new')).toBe('something-new');
    expect(`${auditActionInWords('view')} ${auditSubjectInWords('assessment')}`).toBe('viewed screen');
    expect(auditSubjectInWords('unknown-kind')).toBe('unknown-kind');
  });
});

describe('auditDateErrors (the filter days as typed)', () => {
  it('passes empty and whole days, in order', () => {
    expect(auditDateErrors('', '')).toEqual({});
    expect(auditDateErrors('2026-12-01', '2026-12-05')).toEqual({});
    expect(auditDateErrors('2026-12-05', '2026-12-05')).toEqual({});
  });
  it('names the field that cannot be sent yet', () => {
    expect(auditDateErrors('2026-1', '')).toEqual({ from: 'Write the date as YYYY-MM-DD.' });
    expect(auditDateErrors('2026-13-01', '')).toEqual({ from: 'This day does not exist in the calendar.' });
    expect(auditDateErrors('', '2026-02-30')).toEqual({ to: 'This day does not exist in the calendar.' });
    expect(auditDateErrors('2026-12-05', '2026-12-01')).toEqual({ to: 'The end is before the start.' });
  });
});
