/**
 * Published sources the engine relies on, named in full once so thresholds,
 * cautions and tests quote them identically. Certainty: "checked" (read in
 * the source or its abstract), "secondary" (read in a text restating it),
 * "from memory" (recalled, not verified), "no source".
 */

export const COMMON_PRACTICE = 'common practice, no source';
export const FROM_MEMORY = 'from memory';
/** A rule Squadline's authors designed: not common practice, and not a published value. */
export const OUR_CHOICE = 'our choice, no source';

export const HERRINGTON_MUNRO_2010 =
  'Herrington L, Munro A. Drop jump landing knee valgus angle; normative data in a physically active population. Phys Ther Sport. 2010;11(2):56-59. doi:10.1016/j.ptsp.2009.11.004';

export const MUNRO_HERRINGTON_CAROLAN_2012 =
  'Munro A, Herrington L, Carolan M. Reliability of 2-dimensional video assessment of frontal-plane dynamic knee valgus during common athletic screening tasks. J Sport Rehabil. 2012;21(1):7-11.';

export const BACKMAN_DANIELSON_2011 =
  'Backman LJ, Danielson P. Low range of ankle dorsiflexion predisposes for patellar tendinopathy in junior elite basketball players. Am J Sports Med. 2011;39(12):2626-2633.';

export const BENNELL_1998 =
  'Bennell K, Talbot R, Wajswelner H, Techovanich W, Kelly D, Hall AJ. Intra-rater and inter-rater reliability of a weight-bearing lunge measure of ankle dorsiflexion. Aust J Physiother. 1998;44(3):175-180.';

export const POWDEN_2015 =
  'Powden CJ, Hoch JM, Hoch MC. Reliability and minimal detectable change of the weight-bearing lunge test: a systematic review. Man Ther. 2015;20(4):524-532.';

export const MIRWALD_2002 =
  'Mirwald RL, Baxter-Jones ADG, Bailey DA, Beunen GP. An assessment of maturity from anthropometric measurements. Med Sci Sports Exerc. 2002;34(4):689-694.';

export const MOORE_2015 = 'Moore SA, McKay HA, Macdonald H, et al. Enhancing a somatic maturity prediction model. Med Sci Sports Exerc. 2015;47(8):1755-1764.';

export const EPLEY_1985 = 'Epley B. Poundage Chart. Boyd Epley Workout. Lincoln, NE: Body Enterprises; 1985.';

export const BRZYCKI_1993 = 'Brzycki M. Strength testing: predicting a one-rep max from reps-to-fatigue. JOPERD. 1993;64(1):88-90.';

export const FAIGENBAUM_2009 =
  'Faigenbaum AD, Kraemer WJ, Blimkie CJR, et al. Youth resistance training: updated position statement paper from the National Strength and Conditioning Association. J Strength Cond Res. 2009;23(5 Suppl):S60-S79.';

export const LLOYD_2014 =
  'Lloyd RS, Faigenbaum AD, Stone MH, et al. Position statement on youth resistance training: the 2014 International Consensus. Br J Sports Med. 2014;48(7):498-505.';

export const CROSSLEY_2011 =
  'Crossley KM, Zhang WJ, Schache AG, Bryant A, Cowan SM. Performance on the single-leg squat task indicates hip abductor muscle function. Am J Sports Med. 2011;39(4):866-873.';

export const ACSM_2009 =
  'American College of Sports Medicine. Progression models in resistance training for healthy adults. Med Sci Sports Exerc. 2009;41(3):687-708.';

/** Short names for the screen ("Herrington & Munro 2010"); the full reference sits behind a "sources" disclosure. */
export const SHORT_CITATIONS: readonly { short: string; full: string }[] = [
  { short: 'Herrington & Munro 2010', full: HERRINGTON_MUNRO_2010 },
  { short: 'Munro, Herrington & Carolan 2012', full: MUNRO_HERRINGTON_CAROLAN_2012 },
  { short: 'Backman & Danielson 2011', full: BACKMAN_DANIELSON_2011 },
  { short: 'Bennell et al. 1998', full: BENNELL_1998 },
  { short: 'Powden, Hoch & Hoch 2015', full: POWDEN_2015 },
  { short: 'Mirwald et al. 2002', full: MIRWALD_2002 },
  { short: 'Moore et al. 2015', full: MOORE_2015 },
  { short: 'Epley 1985', full: EPLEY_1985 },
  { short: 'Brzycki 1993', full: BRZYCKI_1993 },
  { short: 'Faigenbaum et al. 2009', full: FAIGENBAUM_2009 },
  { short: 'Lloyd et al. 2014', full: LLOYD_2014 },
  { short: 'Crossley et al. 2011', full: CROSSLEY_2011 },
  { short: 'ACSM 2009', full: ACSM_2009 },
];

/**
 * The published works a source text cites, as short and full references, in the order they appear.
 * "common practice, no source" and other text without a known reference give an empty list.
 */
export function citationsIn(source: string | null | undefined): { short: string; full: string }[] {
  if (!source) return [];
  return SHORT_CITATIONS.filter((c) => source.includes(c.full)).sort((a, b) => source.indexOf(a.full) - source.indexOf(b.full));
}

/** "Herrington & Munro 2010; Munro, Herrington & Carolan 2012", or the text itself when it cites no known work. */
export function shortSource(source: string | null | undefined): string {
  const cited = citationsIn(source);
  if (cited.length > 0) return cited.map((c) => c.short).join('; ');
  return source ?? '';
}
