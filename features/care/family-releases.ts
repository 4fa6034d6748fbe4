import type { SummaryRelease } from './types';

/**
 * The family page's summaries. A screen shared again after a physiotherapist's decision is the same
 * screen: the page says when it was first shared and when it was updated, and lists under "earlier" only
 * the other screens, each once (its newest sharing). Pure; our choice.
 */
export function familyReleases(latest: SummaryRelease | null, earlier: readonly SummaryRelease[]) {
  const others = new Map<string, SummaryRelease>();
  for (const r of earlier) {
    if (latest && r.assessmentId === latest.assessmentId) continue;
    const kept = others.get(r.assessmentId);
    if (!kept || r.releasedAt > kept.releasedAt) others.set(r.assessmentId, r);
  }
  const sameScreen = latest ? earlier.filter((r) => r.assessmentId === latest.assessmentId) : [];
  const firstSharedAt = latest ? [latest, ...sameScreen].map((r) => r.releasedAt).sort()[0]! : null;
  return {
    firstSharedAt,
    /** The day the current screen's summary was last shared again, or null when it was shared once. */
    updatedAt: latest && sameScreen.length > 0 ? latest.releasedAt : null,
    earlier: [...others.values()].sort((a, b) => (a.releasedAt < b.releasedAt ? 1 : -1)),
  };
}
