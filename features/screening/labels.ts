// Plain words for statuses, severities, sides, thresholds and prescriptions. Pure.
import { capitalise } from '@/features/ui/capitalise';
import { formatDate } from '@/features/ui/format-date';
import type { AssessmentStatus } from './contract';
import type { Certainty, Dose, FlagSide, LoadRule, MaturityStage, Phase, Prescription, Severity, SourceKind, ThresholdRef, Unit } from './engine';

export const STATUS_LABELS: Record<AssessmentStatus, string> = {
  not_started: 'Not started',
  in_progress: 'In progress',
  submitted: 'Submitted',
};

export const SEVERITY_LABELS: Record<Severity, string> = { watch: 'Watch', concern: 'Concern' };

export const PHASE_WORDS: Record<Phase, string> = {
  mobility: 'Mobility',
  activation: 'Activation',
  control: 'Control',
  landing: 'Landing',
  strength: 'Strength',
};

export function sideLabel(side: FlagSide): string | null {
  if (side === 'left') return 'Left side';
  if (side === 'right') return 'Right side';
  if (side === 'both') return 'Both sides';
  return null;
}

/** A value in words; `decimals` 2 for thresholds (18.33°), 1 for measurements (34.5°). */
export function valueText(value: number, unit: Unit, decimals: 1 | 2 = 1): string {
  // A value that rounds to nought reads "0.0", never "-0.0".
  const n = Number.isInteger(value) ? String(value) : decimals === 2 ? String(Math.round(value * 100) / 100) : value.toFixed(1).replace(/^-(0\.0)$/, '$1');
  switch (unit) {
    case 'deg':
      return `${n}°`;
    case 'cm':
      return `${n} cm`;
    case 'percent':
      return `${n}%`;
    case 'years':
      return `${n} years`;
    case 'grades':
      return `${n} ${value === 1 ? 'grade' : 'grades'}`;
    case 'criteria':
      return `${n} ticked ${value === 1 ? 'criterion' : 'criteria'}`;
  }
}

/** "Flagged above 13°", "Flagged at 2 cm or more": never "at at least". */
export function thresholdText(t: ThresholdRef): string {
  const v = valueText(t.value, t.unit, 2);
  switch (t.comparison) {
    case 'within':
      return `Flagged between ${v} and ${valueText(t.upperValue ?? t.value, t.unit, 2)}`;
    case 'greater-than':
      return `Flagged above ${v}`;
    case 'less-than':
      return `Flagged below ${v}`;
    case 'at-least':
      return `Flagged at ${v} or more`;
    case 'at-most':
      return `Flagged at ${v} or less`;
  }
}

const range = (min: number, max: number) => (min === max ? String(min) : `${min}-${max}`);

export function setsText(sets: Prescription['sets']): string {
  return `${range(sets.min, sets.max)} ${sets.max === 1 ? 'set' : 'sets'}`;
}

export function doseText(dose: Dose): string {
  const perSide = dose.perSide ? ' per side' : '';
  if (dose.kind === 'seconds') return `${range(dose.min, dose.max)} s${perSide}`;
  return `${range(dose.min, dose.max)} reps${perSide}${dose.toNearFatigue ? ', close to fatigue' : ''}`;
}

export function loadText(load: LoadRule): string {
  // Notes are written to follow other words ("a light plate held forward…"); each starts a sentence here.
  switch (load.kind) {
    case 'bodyweight':
      return load.note ? `Bodyweight. ${capitalise(load.note)}` : 'Bodyweight';
    case 'band':
      return `${load.resistance === 'light' ? 'Light' : 'Medium'} band, ${load.placement}`;
    case 'percent-1rm': {
      const pct = `${load.minPercent}-${load.maxPercent}% of 1RM`;
      if (load.kg) return `${pct}: ${range(load.kg.min, load.kg.max)} kg (in ${load.kg.incrementKg} kg steps). ${capitalise(load.note)}`;
      // No 1RM: bodyweight comes first, the share after it. Led by the share, a coach read a load to put on
      // a child with no 1RM (the engine's note ends by saying so; it is said here instead).
      const note = capitalise(load.note.replace(/\s*No 1RM recorded:.*$/, ''));
      return `Bodyweight until a 1RM has been estimated (from a submaximal set, under qualified supervision); then ${pct}. ${note}`;
    }
  }
}

export function restText(seconds: number): string {
  return seconds >= 120 && seconds % 60 === 0 ? `${seconds / 60} min rest` : `${seconds} s rest`;
}

export function perWeekText(n: number): string {
  return n === 1 ? 'once a week' : `${n} times a week`;
}

export function todayIsoLocal(now = new Date()): string {
  const p = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${p(now.getMonth() + 1)}-${p(now.getDate())}`;
}

/** What kind of basis a threshold has, as the result screen says it. */
export const SOURCE_KIND_LABELS: Record<SourceKind, string> = {
  published: 'Published value',
  'published-other-population': 'Published value, from another population',
  'common-practice': 'Common practice',
  'our-choice': "Squadline's own choice",
  derived: 'Derived by Squadline from published values',
};

/** How sure we are of a threshold. */
export const CERTAINTY_LABELS: Record<Certainty, string> = {
  checked: 'checked in the source',
  secondary: 'read in a text quoting the source',
  'from memory': 'from memory, not checked',
  'no source': 'no published source',
};

/** "Published value, from another population · checked in the source"; tolerates results stored before these fields. */
export function basisText(t: Pick<ThresholdRef, 'sourceKind' | 'certainty'>): string {
  if (!t.sourceKind) return 'Kind of source not recorded (older result)';
  return `${SOURCE_KIND_LABELS[t.sourceKind]} · certainty: ${CERTAINTY_LABELS[t.certainty]}`;
}

export const STAGE_LABELS: Record<MaturityStage, string> = {
  pre: 'Before the growth spurt',
  circa: 'In the growth-spurt window',
  near: 'Near the growth-spurt window',
  post: 'After the growth spurt',
  unknown: 'Growth stage unknown',
};

/**
 * When to screen again, as the result's plan says it (our wording). Once the date has passed, the page says
 * so rather than "on or after" a day gone by. `rescreenDate` and `today` are YYYY-MM-DD.
 */
export function rescreenWords(rescreenDate: string | null, rescreenWeeks: number, today: string, locale?: string): string {
  const after = `${rescreenWeeks} ${rescreenWeeks === 1 ? 'week' : 'weeks'} after this screen`;
  if (!rescreenDate) return `${capitalise(after)}.`;
  const when = formatDate(rescreenDate, { locale });
  return rescreenDate > today ? `On or after ${when} (${after}).` : `Due since ${when} (${after}), unless the athlete has been screened again.`;
}
