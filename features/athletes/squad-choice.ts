import type { SquadSummary } from './api/types';

// Which squad a squad-wide screen (trends, training sheet) opens on when the address names none. Our choice.

const KEY = 'squadline.squad';

/** The squad last chosen on this device (kept across screens and visits), or null. */
export function rememberedSquad(): string | null {
  try {
    return globalThis.localStorage?.getItem(KEY) ?? null;
  } catch {
    return null;
  }
}

export function rememberSquad(id: string): void {
  try {
    globalThis.localStorage?.setItem(KEY, id);
  } catch {
    // Private mode or no storage: the choice is kept in the address only.
  }
}

/**
 * The squad last chosen here if the club still lists it, else the one with the most athletes (the club's
 * main squad rather than whichever sorts first by name; the first by name among equals), else none.
 */
export function defaultSquadId(squads: readonly Pick<SquadSummary, 'id' | 'athleteCount'>[], remembered: string | null): string | null {
  if (remembered && squads.some((s) => s.id === remembered)) return remembered;
  let best: Pick<SquadSummary, 'id' | 'athleteCount'> | undefined;
  for (const s of squads) if (!best || s.athleteCount > best.athleteCount) best = s;
  return best?.id ?? null;
}
