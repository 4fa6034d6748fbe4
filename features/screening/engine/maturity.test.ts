import { describe, expect, it } from 'vitest';
import { EngineInputError, MATURITY_AGE_RANGE, maturityBand, maturityOffset } from './index';
import type { MaturityInput, MaturityMethod } from './types';

// Worked examples computed by hand from the published coefficients (no source
// prints one). Coefficients: read where other texts restate the two papers below (secondary).
const MIRWALD =
  'Mirwald RL, Baxter-Jones ADG, Bailey DA, Beunen GP. An assessment of maturity from anthropometric measurements. Med Sci Sports Exerc. 2002;34(4):689-694 (coefficients secondary)';
const MOORE =
  'Moore SA, McKay HA, Macdonald H, et al. Enhancing a somatic maturity prediction model. Med Sci Sports Exerc. 2015;47(8):1755-1764 (coefficients secondary)';

const boy13: MaturityInput = { sex: 'male', ageYears: 13, statureCm: 155, sittingHeightCm: 80, massKg: 45 };
const boy15: MaturityInput = { sex: 'male', ageYears: 15.5, statureCm: 172, sittingHeightCm: 89, massKg: 60 };
const boy10: MaturityInput = { sex: 'male', ageYears: 10, statureCm: 140, sittingHeightCm: 72, massKg: 32 };
const girl12: MaturityInput = { sex: 'female', ageYears: 12, statureCm: 150, sittingHeightCm: 78, massKg: 40 };
const girl14: MaturityInput = { sex: 'female', ageYears: 14, statureCm: 160, sittingHeightCm: 84, massKg: 50 };
const girl9: MaturityInput = { sex: 'female', ageYears: 9, statureCm: 132, sittingHeightCm: 69, massKg: 28 };

describe('maturityOffset: worked examples', () => {
  it.each<[string, MaturityInput, MaturityMethod, number, 'pre' | 'circa' | 'post', string]>([
    // LL = 75; -9.236 + 0.0002708*6000 - 0.001663*975 + 0.007216*1040 + 0.02292*(45/155*100)
    //        = -9.236 + 1.6248 - 1.621425 + 7.50464 + 0.6654194 = -1.0625656
    ['boy 13.0 y, 155/80 cm, 45 kg', boy13, 'mirwald2002', -1.0625656, 'pre', MIRWALD],
    // -8.128741 + 0.0070346*(13*80) = -8.128741 + 7.315984 = -0.812757
    ['boy 13.0 y, sitting height 80 cm', boy13, 'moore2015', -0.812757, 'circa', MOORE],
    // LL = 83; -9.236 + 0.0002708*7387 - 0.001663*1286.5 + 0.007216*1379.5 + 0.02292*34.883721 = 1.3789570
    ['boy 15.5 y, 172/89 cm, 60 kg', boy15, 'mirwald2002', 1.378957, 'post', MIRWALD],
    // -8.128741 + 0.0070346*1379.5 = 1.5754897
    ['boy 15.5 y, sitting height 89 cm', boy15, 'moore2015', 1.5754897, 'post', MOORE],
    // LL = 68; -9.236 + 0.0002708*4896 - 0.001663*680 + 0.007216*720 + 0.02292*22.857143 = -3.3215975
    ['boy 10.0 y, 140/72 cm, 32 kg', boy10, 'mirwald2002', -3.3215975, 'pre', MIRWALD],
    ['boy 10.0 y, sitting height 72 cm', boy10, 'moore2015', -3.063829, 'pre', MOORE],
    // LL = 72; -9.376 + 0.0001882*5616 + 0.0022*864 + 0.005841*936 - 0.002658*480 + 0.07693*(40/150*100)
    //        = -9.376 + 1.0569312 + 1.9008 + 5.467176 - 1.27584 + 2.0514667 = -0.1754661
    ['girl 12.0 y, 150/78 cm, 40 kg', girl12, 'mirwald2002', -0.1754661, 'circa', MIRWALD],
    // -7.709133 + 0.0042232*(12*150) = -7.709133 + 7.60176 = -0.107373
    ['girl 12.0 y, stature 150 cm', girl12, 'moore2015', -0.107373, 'circa', MOORE],
    // LL = 76; -9.376 + 0.0001882*6384 + 0.0022*1064 + 0.005841*1176 - 0.002658*700 + 0.07693*31.25 = 1.5787473
    ['girl 14.0 y, 160/84 cm, 50 kg', girl14, 'mirwald2002', 1.5787473, 'post', MIRWALD],
    ['girl 14.0 y, stature 160 cm', girl14, 'moore2015', 1.750835, 'post', MOORE],
    ['girl 9.0 y, 132/69 cm, 28 kg', girl9, 'mirwald2002', -2.7212011, 'pre', MIRWALD],
    ['girl 9.0 y, stature 132 cm', girl9, 'moore2015', -2.6919714, 'pre', MOORE],
  ])('%s (%s) -> %f y, band %s (%s)', (_n, input, method, expected, band, _source) => {
    const r = maturityOffset(input, method);
    expect(r.offsetYears).toBeCloseTo(expected, 6);
    expect(r.ageAtPhvYears).toBeCloseTo(input.ageYears - expected, 6);
    expect(r.band).toBe(band);
    expect(r.method).toBe(method);
  });

  it(`keeps the *100 in the mass-for-stature term (${MIRWALD})`, () => {
    // Dropping the *100 would give -2.2064181 for the 12-year-old girl.
    const r = maturityOffset(girl12, 'mirwald2002');
    expect(r.offsetYears).not.toBeCloseTo(-2.2064181, 2);
    expect(r.offsetYears).toBeCloseTo(-0.1754661, 6);
  });

  it.each<[MaturityMethod, 'male' | 'female', number, string]>([
    ['mirwald2002', 'male', 0.49, MIRWALD],
    ['mirwald2002', 'female', 0.5, MIRWALD],
    ['moore2015', 'male', 0.51, MOORE],
    ['moore2015', 'female', 0.52, MOORE],
  ])('%s %s reports SEE %f y (%s, checked)', (method, sex, see) => {
    const input = sex === 'male' ? boy13 : girl12;
    expect(maturityOffset(input, method).standardErrorYears).toBe(see);
  });

  it('Moore needs only sitting height for boys and stature for girls', () => {
    expect(() => maturityOffset({ sex: 'male', ageYears: 13, sittingHeightCm: 80 }, 'moore2015')).not.toThrow();
    expect(() => maturityOffset({ sex: 'female', ageYears: 12, statureCm: 150 }, 'moore2015')).not.toThrow();
  });
});

describe('maturityBand (common practice, no source)', () => {
  it.each<[number, 'pre' | 'circa' | 'post']>([
    [-1.01, 'pre'],
    [-1, 'circa'],
    [-0.99, 'circa'],
    [0, 'circa'],
    [0.99, 'circa'],
    [1, 'circa'],
    [1.01, 'post'],
  ])('offset %f -> %s', (offset, band) => {
    expect(maturityBand(offset)).toBe(band);
  });
});

describe('maturityOffset: refusals', () => {
  it.each<[string, MaturityInput, MaturityMethod, string]>([
    ['girl above 16 (from memory: equations derived on about 8-16 y)', { ...girl12, ageYears: 16.5 }, 'moore2015', 'ageYears'],
    ['girl below 8', { ...girl12, ageYears: 7.9 }, 'mirwald2002', 'ageYears'],
    ['boy below 9 (from memory: about 9-18 y)', { ...boy13, ageYears: 8.9 }, 'moore2015', 'ageYears'],
    ['boy above 18', { ...boy13, ageYears: 18.1 }, 'mirwald2002', 'ageYears'],
    ['Mirwald without mass', { sex: 'male', ageYears: 13, statureCm: 155, sittingHeightCm: 80 }, 'mirwald2002', 'massKg'],
    ['Moore boy without sitting height', { sex: 'male', ageYears: 13, statureCm: 155 }, 'moore2015', 'sittingHeightCm'],
    ['Moore girl without stature', { sex: 'female', ageYears: 12, sittingHeightCm: 78 }, 'moore2015', 'statureCm'],
    ['sitting height not below stature', { ...boy13, sittingHeightCm: 155 }, 'mirwald2002', 'sittingHeightCm'],
    ['stature in metres', { ...girl12, statureCm: 1.5 }, 'moore2015', 'statureCm'],
    ['negative mass', { ...girl12, massKg: -40 }, 'mirwald2002', 'massKg'],
    ['NaN age', { ...girl12, ageYears: Number.NaN }, 'moore2015', 'ageYears'],
  ])('%s', (_n, input, method, field) => {
    expect(() => maturityOffset(input, method)).toThrow(expect.objectContaining({ name: 'EngineInputError', field }));
  });

  it('accepts the range ends exactly', () => {
    const f = MATURITY_AGE_RANGE.female;
    const m = MATURITY_AGE_RANGE.male;
    expect(() => maturityOffset({ ...girl12, ageYears: f.min }, 'moore2015')).not.toThrow();
    expect(() => maturityOffset({ ...girl12, ageYears: f.max }, 'moore2015')).not.toThrow();
    expect(() => maturityOffset({ ...boy13, ageYears: m.min }, 'moore2015')).not.toThrow();
    expect(() => maturityOffset({ ...boy13, ageYears: m.max }, 'moore2015')).not.toThrow();
  });

  it('refuses an unknown method', () => {
    expect(() => maturityOffset(girl12, 'khamis' as MaturityMethod)).toThrow(EngineInputError);
  });
});
