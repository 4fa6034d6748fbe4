import { describe, expect, it } from 'vitest';
import { makeRosterLine } from '@/test/fixtures/roster';
import { rosterRowSchema } from './roster-row';

// One line as a spreadsheet writes it (the import tests' own line), the cell under test overridden.
const line = (overrides: Record<string, string> = {}) => makeRosterLine(overrides);

describe('rosterRowSchema: spreadsheet shorthands (Squadline’s own import format)', () => {
  it.each([
    ['sex', 'F', 'female'],
    ['sex', ' male ', 'male'],
    ['sex', 'm', 'male'],
    ['racket_hand', 'l', 'left'],
    ['racket_hand', 'RIGHT', 'right'],
    ['take_off_leg', 'R', 'right'],
    ['photo_consent', 'Y', true],
    ['photo_consent', 'true', true],
    ['photo_consent', 'No', false],
    ['email_summaries_consent', 'n', false],
    ['email_summaries_consent', 'FALSE', false],
    ['guardian_email', ' Parent@Example.TEST ', 'parent@example.test'],
    ['guardian_email', '', undefined],
    ['screening_consent', 'y', true],
    ['screening_consent', 'NO', false],
    // Empty: no decision recorded (the athlete is not screened until one is).
    ['screening_consent', '', undefined],
    ['consents_decided_on', '', undefined],
    ['consents_decided_on', ' 2026-09-05 ', '2026-09-05'],
  ])('%s "%s" reads as %j', async (column, cell, expected) => {
    const row = await rosterRowSchema.validate(line({ [column]: cell }));
    expect(row[column as keyof typeof row]).toEqual(expected);
  });

  it.each([
    ['sex', 'x', /F or M/],
    ['racket_hand', 'both', /L or R/],
    ['photo_consent', 'maybe', /yes or no/],
    ['photo_consent', '', /yes or no/],
    ['screening_consent', 'maybe', /yes or no for the screening and exercises consent/],
    ['date_of_birth', '2014/03/09', /YYYY-MM-DD/],
    ['squad', ' ', /squads/],
  ])('%s "%s" is refused', async (column, cell, message) => {
    await expect(rosterRowSchema.validate(line({ [column]: cell }))).rejects.toThrow(message);
  });
});
