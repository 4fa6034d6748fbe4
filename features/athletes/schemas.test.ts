import { describe, expect, it } from 'vitest';
import { athleteSchema, consentSchema, isCalendarDate, rosterRowSchema, withDateDashes } from './schemas';

const dobAged = (years: number) => `${new Date().getUTCFullYear() - years - 1}-11-15`;

const line = (overrides: Record<string, string> = {}) => ({
  first_name: 'Ines',
  last_name: 'Marlow',
  date_of_birth: dobAged(11),
  sex: 'F',
  racket_hand: 'R',
  take_off_leg: 'L',
  squad: 'Under-13',
  photo_consent: 'yes',
  email_summaries_consent: 'no',
  guardian_email: '',
  ...overrides,
});

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

describe('date of birth: juniors aged 6 to 19 today', () => {
  it.each([
    [6, true],
    [12, true],
    [18, true],
    [4, false],
    [21, false],
  ])('aged %i (or one more): accepted %s', async (years, ok) => {
    const input = {
      firstName: 'A',
      lastName: 'B',
      dateOfBirth: dobAged(years),
      sex: 'female',
      racketHand: 'left',
      takeOffLeg: 'left',
      squadId: '0f8fad5b-d9cb-469f-a165-70867728950e',
    };
    expect(await athleteSchema.isValid(input)).toBe(ok);
  });

  it.each([
    ['2014-02-28', true],
    ['2012-02-29', true],
    ['2014-02-29', false],
    ['2014-13-01', false],
    ['14-02-01', false],
  ])('%s is a calendar day: %s', (value, ok) => {
    expect(isCalendarDate(value)).toBe(ok);
  });
});

describe('consentSchema', () => {
  it('refuses a decision dated in the future', async () => {
    await expect(consentSchema.validate({ kind: 'photos', granted: true, decidedOn: '2999-01-01' })).rejects.toThrow(/future/);
  });
});

describe('withDateDashes (a number pad without a dash)', () => {
  it('writes eight digits as YYYY-MM-DD and leaves anything else as typed', () => {
    expect(withDateDashes('20140309')).toBe('2014-03-09');
    expect(withDateDashes('2014-03-09')).toBe('2014-03-09');
    expect(withDateDashes('2014030')).toBe('2014030');
    expect(withDateDashes('09/03/2014')).toBe('09/03/2014');
  });
});
