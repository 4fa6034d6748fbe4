import { describe, expect, it } from 'vitest';
import { recheckLine } from '@/features/care/family-words';
import { renderSummaryEmail } from './summary-email';
import type { FamilySummary } from '@/features/care/types';

// The next check in the family e-mail: a date that has gone by by the time the e-mail is written is said to
// be due now (the family page says the same). Wording and rule: our choice.
describe('the next check in the family e-mail', () => {
  it('gives the date while it is ahead, and the day itself counts as ahead', () => {
    expect(recheckLine('2027-01-11', '2026-12-05')).toBe('Next check: around 11 January 2027.');
    expect(recheckLine('2026-12-05', '2026-12-05')).toBe('Next check: around 5 December 2026.');
  });

  it('says it is due now once the date has gone by, with the date it was planned for', () => {
    expect(recheckLine('2026-10-26', '2026-12-05')).toBe('Next check: due now (it was planned for around 26 October 2026); the coaches will arrange it.');
  });

  it('is what the rendered e-mail says, in its text and HTML parts', async () => {
    const summary = {
      athleteFirstName: 'Nia',
      clubName: 'Riverside Juniors',
      screenedOn: '2026-08-20',
      checked: ['Two-leg full squat'],
      seen: ['Nothing that needs extra work was seen on the day.'],
      exercises: [],
      onHold: null,
      clearance: null,
      howOften: 'Nothing extra to work on for now: Nia keeps training as usual.',
      recheckDate: '2026-10-26',
      contact: 'Questions? Speak to the coaches at Riverside Juniors.',
      cautions: ['This summary describes how Nia moved on the day of the screen. It is not a diagnosis.'],
    } satisfies FamilySummary;
    const mail = await renderSummaryEmail({
      summary,
      viewUrl: 'http://localhost/f',
      unsubscribeUrl: 'http://localhost/u',
      recipientName: 'Ada',
      today: '2026-12-05',
    });
    expect(mail.text).toContain('Next check: due now (it was planned for around 26 October 2026)');
    expect(mail.html).toContain('due now (it was planned for around 26 October 2026)');
  });
});
