// The words of a training sheet's lines, from a prescription. Pure; the sheet's layout is ours (our
// choice), the wording of each part is the result screen's (`features/screening/labels.ts`).
import { doseText, loadText, perWeekText, restText, setsText } from '@/features/screening/labels';
import type { Prescription } from '@/features/screening/engine/types';
import type { SheetEntry } from './sheet';

type Line = Pick<SheetEntry, 'prescription' | 'adjustments' | 'held'>;

/** "3 sets × 12-15 reps per side": what the athlete does. */
export function doseLine(p: Prescription): string {
  return `${setsText(p.sets)} × ${doseText(p.dose)}`;
}

/** "Tempo 2 s up, 2 s down · 45 s rest · 3 times a week": how, which is the same for most athletes. */
export function detailLine(p: Prescription): string {
  return [p.tempo ? `Tempo ${p.tempo}` : '', restText(p.restSeconds), perWeekText(p.perWeek)].filter(Boolean).join(' · ');
}

/** The detail line every athlete under an exercise shares, said once above them; null when they differ. */
export function sharedDetail(entries: readonly Pick<SheetEntry, 'prescription'>[]): string | null {
  const lines = new Set(entries.map((e) => detailLine(e.prescription)));
  return lines.size === 1 ? [...lines][0]! : null;
}

/** Athletes under one exercise who do exactly the same today: one dose, load and set of adjustments. */
export type DoseGroup<E> = { held: boolean; dose: string; load: string; detail: string; adjustments: string[]; entries: E[] };

/**
 * The athletes under an exercise gathered by what they do, so each dose is said once above the names it
 * applies to (most often one group: everyone on the library's prescription). Groups come in the order their
 * first athlete is listed; athletes whose work is on hold form one group, last (they do not do it today).
 */
export function doseGroups<E extends Line>(entries: readonly E[]): DoseGroup<E>[] {
  const groups = new Map<string, DoseGroup<E>>();
  let held: DoseGroup<E> | null = null;
  for (const e of entries) {
    if (e.held) {
      held ??= { held: true, dose: '', load: '', detail: '', adjustments: [], entries: [] };
      held.entries.push(e);
      continue;
    }
    const g = { dose: doseLine(e.prescription), load: loadText(e.prescription.load), detail: detailLine(e.prescription), adjustments: e.adjustments };
    const key = [g.dose, g.load, g.detail, ...g.adjustments].join('\n');
    const group = groups.get(key) ?? { held: false, ...g, entries: [] };
    group.entries.push(e);
    groups.set(key, group);
  }
  return held ? [...groups.values(), held] : [...groups.values()];
}
