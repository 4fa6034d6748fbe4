import { recordAudit, type AuditEntry } from '@/server/care/audit.repo';
import { parse } from 'csv-parse/sync';
import { ValidationError } from 'yup';
import type { Db } from '@/db/client';
import { todayIso } from '@/features/athletes/age';
import { ageGroupCheck } from '@/features/athletes/age-group';
import { ROLE_LABELS } from '@/features/access/permissions';
import { OPTIONAL_ROSTER_COLUMNS, ROSTER_COLUMNS, ROSTER_HEADER_LINE, type RosterColumn } from '@/features/athletes/schemas';
import { rosterRowSchema, type RosterRow } from './roster-row';
import type { ClubScope } from '@/server/access/scope';
import { badRequest } from '@/server/http/errors';
import { fieldErrors } from '@/server/http/validate';
import { athletesRepo, identityKey, type AthletesRepo, type AthleteView } from './athletes.repo';

export const MAX_IMPORT_BYTES = 1024 * 1024;
export const MAX_IMPORT_ROWS = 1000;

export type RawRow = { line: number; values: Partial<Record<RosterColumn, string>>; extraCells: number };
export type ReportRow = {
  line: number;
  ok: boolean;
  errors: Record<string, string>;
  values: Partial<Record<RosterColumn, string>>;
  /** For a line without errors: a new athlete, or one already in the club (same name and date of birth). */
  action?: 'create' | 'update';
  /** For an update: what the import changes, in plain words (empty: nothing differs). */
  changes?: string[];
  /** For a line without errors: what to look at before importing, never a refusal (a child older than the squad's name says). */
  checks?: string[];
};
export type ImportReport = { rows: ReportRow[]; okCount: number; errorCount: number; createCount: number; updateCount: number };

const HEADER_HINT = `The first line must name the columns: ${ROSTER_HEADER_LINE}`;

/**
 * Reads an uploaded file as a roster CSV: UTF-8 text, a header naming the expected columns (any case,
 * any order), one athlete per line. Throws a 400 that says what is wrong with the file as a whole;
 * problems of single lines are left to the per-row report.
 */
export function readRosterCsv(bytes: Buffer): RawRow[] {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw badRequest('This file is not a CSV text file (it is not UTF-8 text). In a spreadsheet, use “Save as CSV UTF-8”.');
  }
  if (text.includes('\u0000')) throw badRequest('This file is not a CSV text file. In a spreadsheet, use “Save as CSV UTF-8”.');
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(text, { bom: true, trim: true, skip_empty_lines: true, relax_column_count: true, info: true }) as never;
  } catch (error) {
    const line = (error as { lines?: number }).lines;
    throw badRequest(`This file could not be read as CSV${line ? ` (near line ${line})` : ''}: check for an unclosed quote mark.`);
  }
  const [header, ...body] = records;
  if (!header) throw badRequest(`The file is empty. ${HEADER_HINT}`);

  const names = header.record.map((h) =>
    h
      .trim()
      .toLowerCase()
      .replace(/[\s-]+/g, '_'),
  );
  const unknown = names.filter((n) => n !== '' && !(ROSTER_COLUMNS as readonly string[]).includes(n));
  const missing = ROSTER_COLUMNS.filter((c) => !names.includes(c) && !OPTIONAL_ROSTER_COLUMNS.includes(c));
  const repeated = names.filter((n, i) => n !== '' && names.indexOf(n) !== i);
  if (missing.length > 0 || unknown.length > 0 || repeated.length > 0) {
    const parts = [
      missing.length ? `missing column${missing.length > 1 ? 's' : ''}: ${missing.join(', ')}` : '',
      unknown.length ? `unknown column${unknown.length > 1 ? 's' : ''}: ${unknown.join(', ')}` : '',
      repeated.length ? `repeated column${repeated.length > 1 ? 's' : ''}: ${repeated.join(', ')}` : '',
    ].filter(Boolean);
    throw badRequest(`The header line does not match (${parts.join('; ')}). ${HEADER_HINT}`);
  }
  if (body.length === 0) throw badRequest('The file has a header line but no athletes.');
  if (body.length > MAX_IMPORT_ROWS) throw badRequest(`The file has ${body.length} athletes; import at most ${MAX_IMPORT_ROWS} at a time.`);

  return body.map(({ record, info }) => {
    const values: Partial<Record<RosterColumn, string>> = {};
    names.forEach((n, i) => {
      if ((ROSTER_COLUMNS as readonly string[]).includes(n)) values[n as RosterColumn] = record[i] ?? '';
    });
    return { line: info.lines, values, extraCells: Math.max(0, record.length - names.length) };
  });
}

type CheckedRow = ReportRow & { row?: RosterRow; squadId?: string; guardianUserId?: string; guardianName?: string; existing?: AthleteView };

const yesNo = (v: boolean | null | undefined) => (v === true ? 'yes' : v === false ? 'no' : 'not recorded');

/**
 * What importing `row` over `current` changes, in the words of the report; a parent account the line
 * names that is linked to the child already is no change.
 */
function changesOf(
  current: AthleteView,
  row: RosterRow,
  squadName: string,
  guardian: { email: string; name: string | undefined; alreadyLinked: boolean } | undefined,
): string[] {
  const out: string[] = [];
  if (current.squadName?.toLowerCase() !== squadName.toLowerCase()) out.push(`squad: ${current.squadName ?? 'none'} → ${squadName}`);
  if (current.sex !== row.sex) out.push(`sex: ${current.sex} → ${row.sex}`);
  if (current.racketHand !== row.racket_hand) out.push(`racket hand: ${current.racketHand} → ${row.racket_hand}`);
  if (current.takeOffLeg !== row.take_off_leg) out.push(`take-off leg: ${current.takeOffLeg} → ${row.take_off_leg}`);
  if (current.consents.photos?.granted !== row.photo_consent) {
    out.push(`photo consent: ${yesNo(current.consents.photos?.granted)} → ${yesNo(row.photo_consent)}`);
  }
  if (current.consents.emailSummaries?.granted !== row.email_summaries_consent) {
    out.push(`e-mail summaries consent: ${yesNo(current.consents.emailSummaries?.granted)} → ${yesNo(row.email_summaries_consent)}`);
  }
  // An empty cell (or no column) leaves the decision in force as it is.
  if (row.screening_consent !== undefined && current.consents.screening?.granted !== row.screening_consent) {
    out.push(`screening and exercises consent: ${yesNo(current.consents.screening?.granted)} → ${yesNo(row.screening_consent)}`);
  }
  if (out.some((line) => line.includes('consent:'))) out.push(datedOn(row));
  if (guardian && !guardian.alreadyLinked) out.push(parentLinked(guardian.email, guardian.name));
  return out;
}

/** The day the line's consent answers are recorded as given: the file's date, or the day of the import. */
const decidedOnOf = (row: RosterRow): string => row.consents_decided_on ?? todayIso();
const datedOn = (row: RosterRow) =>
  row.consents_decided_on ? `consent answers dated ${row.consents_decided_on} (from the file)` : 'consent answers dated today (no date in the file)';

const parentLinked = (email: string, name: string | undefined) => `parent account linked: ${name ? `${name} (${email})` : email}`;

/**
 * What importing `row` records for a child new to the club: the consents as the file gives them and the
 * parent account it links, so that nobody is given a child's photos or access by a line read past.
 */
function recordedFor(row: RosterRow, guardianEmail: string | undefined, guardianName: string | undefined): string[] {
  const out = [
    `screening and exercises consent: ${
      row.screening_consent === undefined ? 'not recorded (not screened until it is)' : row.screening_consent ? 'yes' : 'no (not screened)'
    }`,
    `photo consent: ${yesNo(row.photo_consent)}`,
    `e-mail summaries consent: ${yesNo(row.email_summaries_consent)}`,
    datedOn(row),
  ];
  if (guardianEmail) out.push(parentLinked(guardianEmail, guardianName));
  return out;
}

/**
 * A consent answer of the line that would change a decision dated after the line's: refused, as one
 * decision at a time is (a paper form signed in September does not undo a withdrawal made in November).
 */
function laterDecisionOnRecord(current: AthleteView, row: RosterRow): string | undefined {
  const decidedOn = decidedOnOf(row);
  const asked = [
    { label: 'photo consent', inForce: current.consents.photos, granted: row.photo_consent },
    { label: 'e-mail summaries consent', inForce: current.consents.emailSummaries, granted: row.email_summaries_consent },
    { label: 'screening and exercises consent', inForce: current.consents.screening, granted: row.screening_consent },
  ];
  const later = asked.find((a) => a.granted !== undefined && a.inForce && a.inForce.granted !== a.granted && a.inForce.decidedOn > decidedOn);
  if (later?.inForce) {
    return `A later decision is on record for the ${later.label} (${later.inForce.granted ? 'yes' : 'no'}, decided ${later.inForce.decidedOn}), after ${decidedOn}: it stands. Write the answer on record in this line, or, if the family has decided again since, the day they did.`;
  }
  // A "no" on record turned into a "yes" by a file: only with the day the family agreed again, after the
  // "no" (an old spreadsheet imported again must not undo a withdrawal; our rule).
  const undone = asked.find((a) => a.granted === true && a.inForce?.granted === false);
  if (undone?.inForce && !(row.consents_decided_on && row.consents_decided_on > undone.inForce.decidedOn)) {
    return `The family's “no” to the ${undone.label} (decided ${undone.inForce.decidedOn}) would become a yes. Write the day they agreed again, after ${undone.inForce.decidedOn}, in this column, or keep “no” in the line; a yes can also be recorded on the athlete's page.`;
  }
  return undefined;
}

/** Checks each line against the form's rules and the club's data; writes nothing. */
async function checkRows(repo: AthletesRepo, raw: RawRow[]): Promise<CheckedRow[]> {
  const squadsByName = await repo.activeSquadsByName();
  const known = new Map((await repo.list({ includeArchived: true })).map((a) => [identityKey(a.firstName, a.lastName, a.dateOfBirth), a]));
  const emails = raw.map((r) => r.values.guardian_email?.trim().toLowerCase()).filter((e): e is string => !!e);
  const members = await repo.membersByEmail([...new Set(emails)]);
  const links = await repo.guardianLinkKeys();
  const seen = new Map<string, number>();

  const checked: CheckedRow[] = [];
  for (const { line, values, extraCells } of raw) {
    const errors: Record<string, string> = {};
    let row: RosterRow | undefined;
    try {
      row = await rosterRowSchema.validate(values, { abortEarly: false, stripUnknown: true });
    } catch (error) {
      if (!(error instanceof ValidationError)) throw error;
      Object.assign(errors, fieldErrors(error));
    }
    if (extraCells > 0) errors.row = `This line has ${extraCells} cell${extraCells > 1 ? 's' : ''} more than the header: check for a stray comma.`;

    const squadName = values.squad?.trim();
    const squadId = squadName ? squadsByName.get(squadName.toLowerCase()) : undefined;
    if (squadName && !squadId && !errors.squad) errors.squad = `The club has no squad called “${squadName}”. Create it first or correct the name.`;

    // Checked even when other cells of the line are wrong, so that one pass shows every problem.
    const email = errors.guardian_email ? undefined : values.guardian_email?.trim().toLowerCase() || undefined;
    const member = email ? members.get(email) : undefined;
    if (email && !errors.guardian_email) {
      if (!member) errors.guardian_email = 'No one with this e-mail is in the club yet: invite them from People first, or leave the cell empty.';
      else if (member.role !== 'parent')
        errors.guardian_email = `This e-mail belongs to the club’s ${ROLE_LABELS[member.role].toLowerCase()}, not a parent account.`;
    }

    // A child already in the club (same name and date of birth) is updated from the line, not refused.
    let existing: AthleteView | undefined;
    if (row) {
      const key = identityKey(row.first_name, row.last_name, row.date_of_birth);
      const earlier = seen.get(key);
      if (earlier !== undefined) errors.row = `Same name and date of birth as line ${earlier}.`;
      else if (known.get(key)?.archived) {
        errors.row = 'An archived athlete with this name and date of birth is in the club: restore them first, then import again.';
      } else existing = known.get(key);
      if (earlier === undefined) seen.set(key, line);
      const later = existing ? laterDecisionOnRecord(existing, row) : undefined;
      if (later) errors.consents_decided_on = later;
    }

    const ok = Object.keys(errors).length === 0;
    const ageCheck = ok && row && squadName ? ageGroupCheck(squadName, row.date_of_birth, todayIso()) : null;
    checked.push({
      line,
      ok,
      errors: inColumnOrder(errors),
      values,
      ...(ok
        ? {
            row,
            squadId,
            guardianUserId: member?.userId,
            guardianName: member?.displayName,
            existing,
            action: existing ? ('update' as const) : ('create' as const),
            changes: existing
              ? changesOf(
                  existing,
                  row!,
                  squadName!,
                  email && member ? { email, name: member.displayName, alreadyLinked: links.has(`${existing.id}:${member.userId}`) } : undefined,
                )
              : recordedFor(row!, email, member?.displayName),
            ...(ageCheck ? { checks: [ageCheck] } : {}),
          }
        : {}),
    });
  }
  return checked;
}

/** Errors listed in the order of the columns, the line as a whole last: the order people read the line in. */
function inColumnOrder(errors: Record<string, string>): Record<string, string> {
  const order = [...ROSTER_COLUMNS, 'row'] as readonly string[];
  return Object.fromEntries(Object.entries(errors).sort(([a], [b]) => order.indexOf(a) - order.indexOf(b)));
}

function toReport(checked: CheckedRow[]): ImportReport {
  const rows: ReportRow[] = checked.map(({ line, ok, errors, values, action, changes, checks }) => ({
    line,
    ok,
    errors,
    values,
    ...(action ? { action } : {}),
    ...(changes ? { changes } : {}),
    ...(checks ? { checks } : {}),
  }));
  const okCount = rows.filter((r) => r.ok).length;
  const updateCount = rows.filter((r) => r.action === 'update').length;
  return { rows, okCount, errorCount: rows.length - okCount, createCount: okCount - updateCount, updateCount };
}

export function rosterImport(db: Db, scope: ClubScope) {
  return {
    /** The per-row report, nothing written. */
    async check(raw: RawRow[]): Promise<ImportReport> {
      return toReport(await checkRows(athletesRepo(db, scope), raw));
    },

    /**
     * Writes every line in one transaction, only when no line has an error; otherwise writes nothing
     * and returns the report. The check runs again inside the transaction, under the roster lock.
     */
    async commit(raw: RawRow[]): Promise<{ report: ImportReport; created: string[]; updated: string[] }> {
      return db.transaction(async (tx) => {
        const repo = athletesRepo(tx, scope);
        await repo.lockRoster();
        const checked = await checkRows(repo, raw);
        const report = toReport(checked);
        if (report.errorCount > 0) return { report, created: [], updated: [] };
        const all = checked as (CheckedRow & { row: RosterRow; squadId: string })[];

        // Athletes already in the club: their record follows the line; a consent answer that differs
        // from the one in force is recorded as a new decision (the history keeps the old one).
        const updates = all.filter((c) => c.existing);
        for (const { existing, row, squadId } of updates) {
          await repo.update(existing!.id, { sex: row.sex, racketHand: row.racket_hand, takeOffLeg: row.take_off_leg, squadId });
        }
        const updateConsents = updates.flatMap(({ existing, row }) => {
          const decidedOn = decidedOnOf(row);
          return [
            ...(existing!.consents.photos?.granted !== row.photo_consent
              ? [{ athleteId: existing!.id, kind: 'photos' as const, granted: row.photo_consent, decidedOn }]
              : []),
            ...(existing!.consents.emailSummaries?.granted !== row.email_summaries_consent
              ? [{ athleteId: existing!.id, kind: 'email_summaries' as const, granted: row.email_summaries_consent, decidedOn }]
              : []),
            ...(row.screening_consent !== undefined && existing!.consents.screening?.granted !== row.screening_consent
              ? [{ athleteId: existing!.id, kind: 'screening' as const, granted: row.screening_consent, decidedOn }]
              : []),
          ];
        });
        const updatedConsents = await repo.recordConsents(updateConsents);
        const updatedLinks = updates.flatMap(({ existing, guardianUserId, guardianName }) =>
          guardianUserId ? [{ athleteId: existing!.id, userId: guardianUserId, name: guardianName }] : [],
        );
        const linkedNow = await repo.linkGuardians(updatedLinks.map(({ athleteId, userId }) => ({ athleteId, userId })));

        const ready = all.filter((c) => !c.existing);
        const ids = await repo.createMany(
          ready.map(({ row, squadId }) => ({
            firstName: row.first_name,
            lastName: row.last_name,
            dateOfBirth: row.date_of_birth,
            sex: row.sex,
            racketHand: row.racket_hand,
            takeOffLeg: row.take_off_leg,
            squadId,
          })),
        );
        const newConsents = ready.flatMap(({ row }, i) => {
          const decidedOn = decidedOnOf(row);
          return [
            { athleteId: ids[i]!, kind: 'photos' as const, granted: row.photo_consent, decidedOn },
            { athleteId: ids[i]!, kind: 'email_summaries' as const, granted: row.email_summaries_consent, decidedOn },
            ...(row.screening_consent === undefined ? [] : [{ athleteId: ids[i]!, kind: 'screening' as const, granted: row.screening_consent, decidedOn }]),
          ];
        });
        const createdConsents = await repo.recordConsents(newConsents);
        const newLinks = ready.flatMap(({ guardianUserId, guardianName }, i) =>
          guardianUserId ? [{ athleteId: ids[i]!, userId: guardianUserId, name: guardianName }] : [],
        );
        await repo.linkGuardians(newLinks.map(({ athleteId, userId }) => ({ athleteId, userId })));

        // The trail of the import, in its transaction: each athlete added, each consent with its answer,
        // each parent account linked.
        const entry = (e: Omit<AuditEntry, 'clubId' | 'actorId'>): AuditEntry => ({ clubId: scope.clubId, actorId: scope.userId, ...e });
        await recordAudit(
          tx,
          ...ids.map((id) => entry({ action: 'create', subjectKind: 'athlete', subjectId: id, athleteId: id, detail: { via: 'import' } })),
          ...[
            ...updateConsents.map((c, i) => ({ ...c, id: updatedConsents[i]!.id })),
            ...newConsents.map((c, i) => ({ ...c, id: createdConsents[i]!.id })),
          ].map((c) =>
            entry({
              action: 'create',
              subjectKind: 'consent',
              subjectId: c.id,
              athleteId: c.athleteId,
              detail: { kind: c.kind, granted: c.granted, decidedOn: c.decidedOn, via: 'import' },
            }),
          ),
          // Only links the import made: a line naming a parent already linked changes nothing.
          ...[...updatedLinks.filter((l) => linkedNow.some((n) => n.athleteId === l.athleteId && n.userId === l.userId)), ...newLinks].map((l) =>
            entry({
              action: 'guardian.link',
              subjectKind: 'athlete',
              subjectId: l.athleteId,
              athleteId: l.athleteId,
              detail: { guardian: l.name ?? null, guardianUserId: l.userId, via: 'import' },
            }),
          ),
        );
        return { report, created: ids, updated: updates.map((u) => u.existing!.id) };
      });
    },
  };
}
