import type { MaturityBand, PatternId } from '@/features/screening/engine';

/** Short names for chart legends and table cells (the trade's terms; the engine holds the long titles). */
export const PATTERN_SHORT: Record<PatternId, string> = {
  'dynamic-knee-valgus': 'Knee valgus',
  'contralateral-pelvic-drop': 'Pelvic drop',
  'limited-ankle-dorsiflexion': 'Ankle dorsiflexion',
  'left-right-asymmetry': 'Asymmetry',
  'heels-lifting': 'Heels lift',
  'squat-depth-not-reached': 'Squat depth',
  'excessive-trunk-lean': 'Trunk lean',
  'growth-spurt-window': 'Growth spurt',
};

/** One colour per pattern, distinguishable on paper and screen; legends also name each line. */
export const PATTERN_COLOURS: Record<PatternId, string> = {
  'dynamic-knee-valgus': '#A8321F',
  'contralateral-pelvic-drop': '#2F6FDE',
  'limited-ankle-dorsiflexion': '#8A5300',
  'left-right-asymmetry': '#6B3FA0',
  'heels-lifting': '#0E5A45',
  'squat-depth-not-reached': '#4A5663',
  'excessive-trunk-lean': '#C2185B',
  'growth-spurt-window': '#00838F',
};

export const BAND_LABELS: Record<MaturityBand | 'unknown', string> = {
  pre: 'Before growth spurt',
  circa: 'In growth spurt',
  post: 'After growth spurt',
  unknown: 'Not estimated',
};

/** 'single-leg-squat-left/fppa/left' -> 'Single-leg squat left, left knee'. */
export function kneeAngleName(measurementId: string): string {
  const [scope = '', , side] = measurementId.split('/');
  const task = scope.replace(/-/g, ' ').replace(/^./, (c) => c.toUpperCase());
  return side ? `${task}, ${side} knee` : task;
}

/** The same bands, short enough for a table cell. */
export const BAND_SHORT: Record<MaturityBand | 'unknown', string> = {
  pre: 'Before spurt',
  circa: 'In spurt',
  post: 'After spurt',
  unknown: '–',
};

/**
 * How long ago the last screen was, in words: "today", "yesterday", "81 days ago"; a round dated ahead
 * (entered wrong, or planned) says so: "in 3 days".
 */
export function daysAgo(days: number): string {
  if (days < 0) return days === -1 ? 'in 1 day' : `in ${-days} days`;
  if (days === 0) return 'today';
  if (days === 1) return 'yesterday';
  return `${days} days ago`;
}

/**
 * The filters in force, in the page's words ("in growth spurt", "female"), for the line above the table,
 * the printed report and the CSV's file name: a filtered table says what it was filtered to.
 */
export function filterWords(f: {
  sex?: string;
  ageGroup?: string;
  maturityBand?: MaturityBand | 'unknown' | '';
  flag?: PatternId | 'any' | 'none' | '';
}): string[] {
  const out: string[] = [];
  if (f.sex) out.push(f.sex);
  if (f.ageGroup) out.push(f.ageGroup);
  if (f.maturityBand) out.push(BAND_LABELS[f.maturityBand].toLowerCase());
  if (f.flag) out.push(f.flag === 'any' ? 'any movement flag' : f.flag === 'none' ? 'no movement flag' : `${PATTERN_SHORT[f.flag].toLowerCase()} flagged`);
  return out;
}
