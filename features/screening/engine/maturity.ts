/**
 * Somatic maturity: years from peak height velocity (PHV) from anthropometry.
 * Coefficients from Mirwald et al. 2002 and Moore et al. 2015 (see sources.ts), read where other
 * texts restate the papers (secondary for the coefficients).
 */
import { EngineInputError, requireFinite } from './errors';
import type { MaturityBand, MaturityInput, MaturityMethod, MaturityResult, Sex } from './types';

/**
 * Ages the equations were derived on (from memory: roughly 8-16 years for
 * girls, 9-18 for boys). Outside them the engine refuses rather than
 * extrapolates.
 */
export const MATURITY_AGE_RANGE: Readonly<Record<Sex, { min: number; max: number }>> = {
  female: { min: 8, max: 16 },
  male: { min: 9, max: 18 },
};

/** Broad physiological bounds that catch unit mistakes (metres for cm, grams for kg). */
const STATURE_RANGE_CM = { min: 80, max: 230 };
const SITTING_HEIGHT_RANGE_CM = { min: 40, max: 130 };
const MASS_RANGE_KG = { min: 10, max: 200 };

/** SEE reported by the authors (checked). */
const STANDARD_ERROR_YEARS: Record<MaturityMethod, Record<Sex, number>> = {
  mirwald2002: { male: 0.49, female: 0.5 },
  moore2015: { male: 0.51, female: 0.52 },
};

/** Maturity band around PHV: pre below -1 y, circa -1 to +1 y inclusive, post above +1 y (common practice, no source). */
export function maturityBand(offsetYears: number): MaturityBand {
  if (offsetYears < -1) return 'pre';
  if (offsetYears > 1) return 'post';
  return 'circa';
}

/** Which optional fields a method needs for a given sex (Moore 2015 uses one body measure). */
export function maturityInputsNeeded(method: MaturityMethod, sex: Sex): readonly ('statureCm' | 'sittingHeightCm' | 'massKg')[] {
  if (method === 'mirwald2002') return ['statureCm', 'sittingHeightCm', 'massKg'];
  return sex === 'male' ? ['sittingHeightCm'] : ['statureCm'];
}

function requireIn(field: string, value: unknown, range: { min: number; max: number }, unit: string): number {
  const n = requireFinite(field, value);
  if (n < range.min || n > range.max) {
    throw new EngineInputError(field, `must be between ${range.min} and ${range.max} ${unit}, got ${n}`);
  }
  return n;
}

/**
 * Maturity offset (years from PHV), predicted age at PHV and band.
 * - 'mirwald2002': Mirwald et al. 2002, needs stature, sitting height and mass.
 *   The mass-for-stature term is mass / stature x 100 (some calculators drop
 *   the x 100; we keep it).
 * - 'moore2015': Moore et al. 2015, boys from age x sitting height, girls from
 *   age x stature.
 * Leg length is stature minus sitting height.
 */
export function maturityOffset(input: MaturityInput, method: MaturityMethod): MaturityResult {
  if (typeof input !== 'object' || input === null) {
    throw new EngineInputError('input', 'is missing');
  }
  if (method !== 'mirwald2002' && method !== 'moore2015') {
    throw new EngineInputError('method', `must be 'mirwald2002' or 'moore2015', got ${String(method)}`);
  }
  const sex = input.sex;
  if (sex !== 'female' && sex !== 'male') {
    throw new EngineInputError('sex', `must be 'female' or 'male', got ${String(sex)}`);
  }
  const age = requireFinite('ageYears', input.ageYears);
  const range = MATURITY_AGE_RANGE[sex];
  if (age < range.min || age > range.max) {
    throw new EngineInputError(
      'ageYears',
      `the ${method} equation for ${sex === 'male' ? 'boys' : 'girls'} was derived on ages ${range.min}-${range.max} years; got ${age}`,
    );
  }
  const needed = maturityInputsNeeded(method, sex);
  for (const field of needed) {
    if (input[field] === undefined) {
      throw new EngineInputError(field, `is required by the ${method} equation`);
    }
  }

  let offset: number;
  if (method === 'moore2015') {
    if (sex === 'male') {
      const sh = requireIn('sittingHeightCm', input.sittingHeightCm, SITTING_HEIGHT_RANGE_CM, 'cm');
      offset = -8.128741 + 0.0070346 * (age * sh);
    } else {
      const stature = requireIn('statureCm', input.statureCm, STATURE_RANGE_CM, 'cm');
      offset = -7.709133 + 0.0042232 * (age * stature);
    }
  } else {
    const stature = requireIn('statureCm', input.statureCm, STATURE_RANGE_CM, 'cm');
    const sh = requireIn('sittingHeightCm', input.sittingHeightCm, SITTING_HEIGHT_RANGE_CM, 'cm');
    const mass = requireIn('massKg', input.massKg, MASS_RANGE_KG, 'kg');
    if (sh >= stature) {
      throw new EngineInputError('sittingHeightCm', `must be less than stature (${stature} cm), got ${sh}`);
    }
    const leg = stature - sh;
    const massForStature = (mass / stature) * 100;
    offset =
      sex === 'male'
        ? -9.236 + 0.0002708 * (leg * sh) - 0.001663 * (age * leg) + 0.007216 * (age * sh) + 0.02292 * massForStature
        : -9.376 + 0.0001882 * (leg * sh) + 0.0022 * (age * leg) + 0.005841 * (age * sh) - 0.002658 * (age * mass) + 0.07693 * massForStature;
  }

  return {
    method,
    offsetYears: offset,
    ageAtPhvYears: age - offset,
    band: maturityBand(offset),
    standardErrorYears: STANDARD_ERROR_YEARS[method][sex],
  };
}
