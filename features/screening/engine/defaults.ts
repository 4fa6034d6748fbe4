/**
 * The defaults an assessment takes when its options leave them out. Apart from validate.ts so that a
 * screen needing one of them (the squad trends' re-screen date) does not load the input validation.
 */
import type { MaturityMethod } from './types';

export const DEFAULT_RESCREEN_WEEKS = 6;
export const DEFAULT_LOAD_INCREMENT_KG = 2.5;
export const DEFAULT_MATURITY_METHOD: MaturityMethod = 'moore2015';
