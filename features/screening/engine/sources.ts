/**
 * Published sources the engine relies on, named in full once so thresholds,
 * cautions and tests quote them identically. Certainty follows
 * /work/shared/REFERENCES.md: "checked" (read in the source or its abstract),
 * "secondary" (read in a text restating it), "from memory".
 */

export const COMMON_PRACTICE = 'common practice, no source';
export const FROM_MEMORY = 'from memory';

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

export const MOORE_2015 =
  'Moore SA, McKay HA, Macdonald H, et al. Enhancing a somatic maturity prediction model. Med Sci Sports Exerc. 2015;47(8):1755-1764.';

export const EPLEY_1985 =
  'Epley B. Poundage Chart. Boyd Epley Workout. Lincoln, NE: Body Enterprises; 1985.';

export const BRZYCKI_1993 =
  'Brzycki M. Strength testing: predicting a one-rep max from reps-to-fatigue. JOPERD. 1993;64(1):88-90.';

export const FAIGENBAUM_2009 =
  'Faigenbaum AD, Kraemer WJ, Blimkie CJR, et al. Youth resistance training: updated position statement paper from the National Strength and Conditioning Association. J Strength Cond Res. 2009;23(5 Suppl):S60-S79.';

export const LLOYD_2014 =
  'Lloyd RS, Faigenbaum AD, Stone MH, et al. Position statement on youth resistance training: the 2014 International Consensus. Br J Sports Med. 2014;48(7):498-505.';

export const CROSSLEY_2011 =
  'Crossley KM, Zhang WJ, Schache AG, Bryant A, Cowan SM. Performance on the single-leg squat task indicates hip abductor muscle function. Am J Sports Med. 2011;39(4):866-873.';
