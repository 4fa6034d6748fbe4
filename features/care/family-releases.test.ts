import { describe, expect, it } from 'vitest';
import { familyReleases } from './family-releases';
import type { SummaryRelease } from './types';

const release = (id: string, assessmentId: string, releasedAt: string) => ({ id, assessmentId, releasedAt, summary: {} }) as unknown as SummaryRelease;

// our choice: a screen shared again after a physiotherapist's decision is one screen, updated.
describe('familyReleases', () => {
  it('says when the current screen was first shared and updated, and lists each other screen once', () => {
    const latest = release('r4', 'sep', '2026-12-05T10:00:00Z');
    const earlier = [
      release('r3', 'sep', '2026-12-05T09:00:00Z'),
      release('r2', 'sep', '2026-09-19T08:00:00Z'),
      release('r1b', 'jun', '2026-07-02T08:00:00Z'),
      release('r1', 'jun', '2026-06-20T08:00:00Z'),
      release('r0', 'mar', '2026-03-20T08:00:00Z'),
    ];
    const out = familyReleases(latest, earlier);
    expect(out.firstSharedAt).toBe('2026-09-19T08:00:00Z');
    expect(out.updatedAt).toBe('2026-12-05T10:00:00Z');
    expect(out.earlier.map((r) => r.id)).toEqual(['r1b', 'r0']);
  });

  it('has no update for a screen shared once, and nothing without a summary', () => {
    const latest = release('r1', 'sep', '2026-09-19T08:00:00Z');
    expect(familyReleases(latest, [release('r0', 'jun', '2026-06-20T08:00:00Z')])).toMatchObject({ firstSharedAt: latest.releasedAt, updatedAt: null });
    expect(familyReleases(null, [])).toEqual({ firstSharedAt: null, updatedAt: null, earlier: [] });
  });
});
