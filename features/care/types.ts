// Response shapes of the care-team API, shared by the server and the screens. Pure.
import type { ClearanceHold, ClearanceStatus, NoteVisibility } from './choices';

export type ClearanceView = {
  status: ClearanceStatus;
  detail: string;
  /** "Train with changes": the kinds of work held back until a new clearance (empty otherwise). */
  holds: ClearanceHold[];
  setByName: string | null;
  setAt: string;
} | null;

export type NoteView = {
  id: string;
  athleteId: string;
  assessmentId: string | null;
  visibility: NoteVisibility;
  text: string;
  authorId: string | null;
  authorName: string | null;
  createdAt: string;
  updatedAt: string;
  /** Until when the author may still correct it (ISO); afterwards it is kept as written. */
  editableUntil: string;
  /** The caller wrote it and the edit window is still open. */
  canEdit: boolean;
};

export type ReviewItem = {
  assessmentId: string;
  athleteId: string;
  firstName: string;
  lastName: string;
  squadName: string | null;
  roundName: string;
  screenedOn: string;
  submittedAt: string;
  painReported: boolean;
  clearanceNeeded: boolean;
  flagCount: number;
  concernCount: number;
  clearance: ClearanceView;
  /** Reviewed (of the current result version) but not yet released to the family. */
  reviewedAt: string | null;
  releasedAt: string | null;
};

export type ReviewState = {
  reviewedAt: string | null;
  reviewedByName: string | null;
  releasedAt: string | null;
  releasedByName: string | null;
};

export type FamilyExercise = {
  name: string;
  purpose: string;
  /** What seen at the screen the exercise works on, in family words (absent on summaries released before, or where the plan names none). */
  forWhat?: string;
  howTo: string[];
  cue: string;
  howMuch: string;
  howOften: string;
  /** Loaded strength or landing work: at club sessions with a coach, never alone at home (absent on summaries released before). */
  clubOnly?: boolean;
};

/** The plain-words family summary of one screen. No angles, no diagnosis words. */
export type FamilySummary = {
  athleteFirstName: string;
  clubName: string;
  screenedOn: string;
  checked: string[];
  seen: string[];
  exercises: FamilyExercise[];
  /** That the athlete said something hurt at the screen, and in which movements; null or absent (summaries released before) when not. */
  pain?: string | null;
  /** Loaded strength work held back until a physiotherapist clears it, in plain words; null when nothing is held back. */
  onHold: string | null;
  /** Who cleared (or referred on) the athlete and when, in plain words; null when no decision is recorded. Absent in summaries released before it existed. */
  clearance?: string | null;
  howOften: string;
  recheckDate: string | null;
  contact: string;
  cautions: string[];
};

export type SummaryRelease = { id: string; assessmentId: string; releasedAt: string; summary: FamilySummary };

export type FamilyPhoto = { id: string; thumbUrl: string; url: string; taskTitle: string };

/**
 * The last two released screens compared in family wording (`familySummary` of features/progress/wording.ts):
 * plain sentences, no angles, distances or percentages.
 */
export type FamilyComparison = { earlierScreenedOn: string; laterScreenedOn: string; lines: string[] };

export type FamilyView = {
  athlete: { id: string; firstName: string; lastName: string };
  /** The family's decision in force about screening and corrective exercises; null when none is recorded. */
  takingPart: { granted: boolean; decidedOn: string } | null;
  latest: SummaryRelease | null;
  /** Null until two screens of the child have been released to the family. */
  comparison: FamilyComparison | null;
  /**
   * Since the latest released screen (after its day, up to today): the exercise sessions the child's squad
   * recorded and how many the child took part in. Null without a released screen; `held` 0 where the
   * squad keeps no record.
   */
  sessionsSinceLatest: { attended: number; held: number } | null;
  earlier: SummaryRelease[];
  notes: NoteView[];
  /** Empty unless the club lets parents see their own child's photos and photo consent is in force. */
  photos: FamilyPhoto[];
  photosAllowed: boolean;
  /** The club's setting: whether families see their own child's screening photos at all. */
  clubSharesPhotos: boolean;
};

export type ReleasePreview = {
  subject: string;
  html: string;
  text: string;
  recipients: { displayName: string; email: string }[];
  /** Parents linked to the athlete who will not get it, and why. */
  skipped: { displayName: string; reason: string }[];
};

export type AuditRow = {
  id: string;
  at: string;
  actorId: string | null;
  actorName: string | null;
  action: string;
  subjectKind: string;
  subjectId: string | null;
  athleteId: string | null;
  athleteName: string | null;
  detail: Record<string, unknown>;
};

export type CareSettingsView = {
  autoReleaseDays: number | null;
  photoGraceDays: number;
  photoRetentionMonths: number;
  familyPhotos: boolean;
  testersReadTeamNotes: boolean;
};

export type RetentionCandidate = {
  photoId: string;
  athleteId: string;
  athleteName: string;
  takenAt: string;
  reason: 'consent-withdrawn' | 'retention-expired';
};
