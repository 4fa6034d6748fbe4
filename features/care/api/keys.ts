// One key factory for the care team. Every care mutation invalidates `careKeys.club(clubId)`.
export const careKeys = {
  root: ['care'] as const,
  club: (clubId: string) => [...careKeys.root, clubId] as const,
  reviews: (clubId: string) => [...careKeys.club(clubId), 'reviews'] as const,
  clearances: (clubId: string) => [...careKeys.club(clubId), 'clearances'] as const,
  clearanceHistory: (clubId: string, athleteId: string) => [...careKeys.club(clubId), 'clearance-history', athleteId] as const,
  notes: (clubId: string, athleteId: string) => [...careKeys.club(clubId), 'notes', athleteId] as const,
  assessment: (clubId: string, assessmentId: string) => [...careKeys.club(clubId), 'assessment', assessmentId] as const,
  preview: (clubId: string, assessmentId: string) => [...careKeys.assessment(clubId, assessmentId), 'preview'] as const,
  family: (clubId: string, athleteId: string) => [...careKeys.club(clubId), 'family', athleteId] as const,
  audit: (clubId: string, filters: Record<string, string | undefined>) => [...careKeys.club(clubId), 'audit', filters] as const,
  settings: (clubId: string) => [...careKeys.club(clubId), 'settings'] as const,
};
export const CARE_STALE_MS = 30 * 1000;
