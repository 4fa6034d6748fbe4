import { describe, expect, it } from 'vitest';
import { consentGapLines, hasConsentGaps } from './consent-gaps';

// Our wording and rule: the admin's home counts the decisions not recorded yet (archived athletes aside).
describe('consentGapLines', () => {
  const yes = { granted: true, decidedOn: '2026-09-01' };
  const athlete = (screening: typeof yes | null, photos: typeof yes | null, archived = false) =>
    ({ archived, consents: { screening, photos, emailSummaries: null } }) as never;

  it('counts athletes without a screening or a photo decision, leaving out the archived', () => {
    expect(consentGapLines([athlete(null, yes), athlete(null, null), athlete(yes, null), athlete(null, null, true), athlete(yes, yes)])).toEqual([
      "2 athletes have no screening decision recorded: not screened until the family's answer is.",
      '2 athletes have no photo decision recorded: no photos are taken of them.',
    ]);
    expect(consentGapLines([athlete(null, yes)])).toEqual(["1 athlete has no screening decision recorded: not screened until the family's answer is."]);
  });

  it('counts the athletes with no parent account linked, where the count is known (staff only get it)', () => {
    const linked = (n: number | undefined, archived = false) =>
      ({ archived, guardianCount: n, consents: { screening: yes, photos: yes, emailSummaries: null } }) as never;
    expect(consentGapLines([linked(0), linked(2), linked(0), linked(0, true), linked(undefined)])).toEqual([
      'Every athlete has a screening and a photo decision recorded.',
      '2 athletes have no parent account linked: no family reads their summaries or answers for them in the app.',
    ]);
    expect(hasConsentGaps([linked(1), linked(0, true)])).toBe(false);
    expect(hasConsentGaps([linked(1), linked(0)])).toBe(true);
    expect(hasConsentGaps([athlete(yes, null)])).toBe(true);
  });

  it('says all is recorded when it is, and nothing for a club without athletes', () => {
    expect(consentGapLines([athlete(yes, yes)])).toEqual(['Every athlete has a screening and a photo decision recorded.']);
    expect(consentGapLines([])).toEqual([]);
  });
});
