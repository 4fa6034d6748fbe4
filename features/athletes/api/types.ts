import type { ClearanceView } from '@/features/care/types';
import type { ConsentKind, RosterColumn } from '../schemas';

export type ConsentView = { granted: boolean; decidedOn: string } | null;
export type Guardian = { userId: string; displayName: string; email: string };
export type Athlete = {
  id: string;
  clubId: string;
  squadId: string | null;
  squadName: string | null;
  firstName: string;
  lastName: string;
  dateOfBirth: string;
  sex: 'female' | 'male';
  racketHand: 'left' | 'right';
  takeOffLeg: 'left' | 'right';
  archived: boolean;
  consents: { screening: ConsentView; photos: ConsentView; emailSummaries: ConsentView };
  /** The physiotherapist's clearance in force (newest decision), or null when none was recorded. */
  clearance: ClearanceView;
  /** Club staff only; parents do not see the other adults linked to a child. */
  guardians?: Guardian[];
  /** Club staff only: addresses invited as this child's parent that have not accepted yet. */
  invitedGuardians?: { email: string; sentAt: string }[];
  /** In the list, for club staff only: how many parent accounts are linked to the child. */
  guardianCount?: number;
};
export type SquadSummary = {
  id: string;
  name: string;
  athleteCount: number;
  /** The squad's last corrective session recorded from its training sheet, and how many took part. */
  lastSession: { heldOn: string; attended: number } | null;
};
export type Squad = { id: string; name: string; archived: boolean };
export type ConsentRecord = {
  id: string;
  kind: ConsentKind;
  granted: boolean;
  decidedOn: string;
  recordedBy: string | null;
  recordedAt: string;
};
export type ImportReportRow = {
  line: number;
  ok: boolean;
  /** Keyed by CSV column, or `row` for the line as a whole. */
  errors: Partial<Record<RosterColumn | 'row', string>>;
  values: Partial<Record<RosterColumn, string>>;
  /** For a line without errors: a new athlete, or one already in the club (same name and date of birth) to update. */
  action?: 'create' | 'update';
  /** An update: what the import changes; a new athlete: the consents recorded and the parent account linked. In plain words. */
  changes?: string[];
  /** A line without errors: what to look at before importing (a child older than the squad's name says); never a refusal. */
  checks?: string[];
};
export type ImportReport = {
  rows: ImportReportRow[];
  okCount: number;
  errorCount: number;
  createCount: number;
  updateCount: number;
  created?: number;
  updated?: number;
};
