import { describe, expect, it } from 'vitest';
import { athleteSchema, consentSchema, isCalendarDate, withDateDashes } from './schemas';

const dobAged = (years: number) => `${new Date().getUTCFullYear() - years - 1}-11-15`;

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
