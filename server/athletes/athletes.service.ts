import { eq } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { athletes } from '@/db/schema';
import { can, ROLE_LABELS } from '@/features/access/permissions';
import { todayIso } from '@/features/athletes/age';
import { formatDateInWords } from '@/features/ui/format-date';
import {
  CONSENT_FIELDS,
  type AthleteInput,
  type AthletePatchInput,
  type ConsentInput,
  type GuardianInput,
  type OwnConsentInput,
  type SquadInput,
} from '@/features/athletes/schemas';
import type { ClubScope } from '@/server/access/scope';
import { recordAudit } from '@/server/care/audit.repo';
import { AppError, badRequest, conflict, forbidden, notFound } from '@/server/http/errors';
import { athletesRepo, type AthleteValues, type AthletesRepo, type AthleteView, type GuardianView } from './athletes.repo';

export const DUPLICATE_MESSAGE = 'An athlete with this name and date of birth is already in the club.';
const DUPLICATE_ARCHIVED_MESSAGE = 'An archived athlete with this name and date of birth is in the club: restore them instead.';

/** The athlete's decision in force of one kind (null: none recorded). */
const consentInForce = (athlete: AthleteView, kind: ConsentInput['kind']) => athlete.consents[CONSENT_FIELDS[kind]];

export type AthleteDetail = AthleteView & { guardians?: GuardianView[]; invitedGuardians?: { email: string; sentAt: string }[] };

/** Rules of the roster, on top of a repository built from the caller's scope. */
export function athletesService(db: Db, scope: ClubScope) {
  const repo = athletesRepo(db, scope);

  async function mustGet(id: string): Promise<AthleteView> {
    const athlete = await repo.get(id);
    // The athlete exists in this club (the router looked its club up) but is outside the caller's scope.
    if (!athlete) throw forbidden('You can only see the athletes linked to you.');
    return athlete;
  }

  async function detail(id: string): Promise<AthleteDetail> {
    const athlete = await mustGet(id);
    // Parents see their child, not the other adults linked to them.
    if (!can(scope.role, 'guardians.read')) return athlete;
    // Invited as this child's parent and not joined yet: shown beside the links, so nobody invites twice.
    const invited = (await repo.openInvitations({ athleteId: id })).map(({ email, sentAt }) => ({ email, sentAt }));
    return { ...athlete, guardians: await repo.guardians(id), invitedGuardians: invited };
  }

  async function activeSquadOrFail(r: AthletesRepo, squadId: string) {
    const squad = await r.squad(squadId);
    if (!squad || squad.archivedAt) throw badRequest('Choose one of the club’s squads.', { squadId: 'Choose one of the club’s squads.' });
    return squad;
  }

  async function refuseDuplicate(r: AthletesRepo, v: Pick<AthleteValues, 'firstName' | 'lastName' | 'dateOfBirth'>, exceptId?: string) {
    const same = await r.sameIdentity(v.firstName, v.lastName, v.dateOfBirth, exceptId);
    if (same.length > 0) {
      const message = same.every((s) => s.archived) ? DUPLICATE_ARCHIVED_MESSAGE : DUPLICATE_MESSAGE;
      throw new AppError(409, 'duplicate', message, { firstName: message });
    }
  }

  return {
    detail,

    async create(input: AthleteInput): Promise<AthleteDetail> {
      const id = await db.transaction(async (tx) => {
        const r = athletesRepo(tx, scope);
        await r.lockRoster();
        await activeSquadOrFail(r, input.squadId);
        await refuseDuplicate(r, input);
        const created = await r.create(input);
        await recordAudit(tx, {
          clubId: scope.clubId,
          actorId: scope.userId,
          action: 'create',
          subjectKind: 'athlete',
          subjectId: created,
          athleteId: created,
          detail: { via: 'form' },
        });
        return created;
      });
      return detail(id);
    },

    async update(id: string, patch: AthletePatchInput): Promise<AthleteDetail> {
      const current = await mustGet(id);
      if (current.archived) throw conflict('This athlete is archived: restore them before editing.');
      await db.transaction(async (tx) => {
        const r = athletesRepo(tx, scope);
        await r.lockRoster();
        if (patch.squadId !== undefined && patch.squadId !== current.squadId) await activeSquadOrFail(r, patch.squadId);
        const merged = { ...current, ...definedOnly(patch) };
        if (patch.firstName !== undefined || patch.lastName !== undefined || patch.dateOfBirth !== undefined) {
          await refuseDuplicate(r, merged, id);
        }
        await r.update(id, definedOnly(patch));
      });
      return detail(id);
    },

    async setArchived(id: string, archived: boolean): Promise<AthleteDetail> {
      const current = await mustGet(id);
      if (current.archived === archived) return detail(id);
      await db.transaction(async (tx) => {
        const r = athletesRepo(tx, scope);
        await r.setArchived(id, archived);
        // Squads are archived only when empty, so a restored athlete may come back to an archived squad:
        // they return without a squad, to be placed by the coach.
        if (!archived && current.squadId) {
          const squad = await r.squad(current.squadId);
          if (!squad || squad.archivedAt) await r.update(id, { squadId: null });
        }
      });
      return detail(id);
    },

    async consentHistory(id: string) {
      await mustGet(id);
      return repo.consentHistory(id);
    },

    async recordConsent(id: string, input: ConsentInput) {
      const athlete = await mustGet(id);
      // A family cannot have decided before the child was born (the roster import refuses it too).
      if (input.decidedOn < athlete.dateOfBirth) {
        throw badRequest('Check the day of the decision.', {
          decidedOn: `The day of the decision (${formatDateInWords(input.decidedOn)}) is before ${athlete.firstName}'s date of birth (${formatDateInWords(athlete.dateOfBirth)}).`,
        });
      }
      // The newest recorded decision is in force: one dated before the decision in force would overturn a
      // later choice of the family (a parent's "no" in the app, then an old paper "yes" typed in). Our rule.
      const inForce = consentInForce(athlete, input.kind);
      if (inForce && input.decidedOn < inForce.decidedOn) {
        const message = `A later decision is on record (${inForce.granted ? 'yes' : 'no'}, decided ${formatDateInWords(inForce.decidedOn)}). If the family has decided again since, record it with the day they did.`;
        throw new AppError(409, 'later_decision_on_record', message, { decidedOn: message });
      }
      const [row] = await repo.recordConsents([{ athleteId: id, kind: input.kind, granted: input.granted, decidedOn: input.decidedOn }]);
      // Which consent and which answer: a withdrawal never reads like a grant in the trail.
      await recordAudit(db, {
        clubId: scope.clubId,
        actorId: scope.userId,
        action: 'create',
        subjectKind: 'consent',
        subjectId: row!.id,
        athleteId: id,
        detail: { kind: input.kind, granted: input.granted, decidedOn: input.decidedOn },
      });
      return { athlete: await detail(id), consents: await repo.consentHistory(id) };
    },

    /**
     * A parent's own decision about their child, made in the app and dated today (the day it is recorded).
     * A decision equal to the one in force records nothing (a double tap, two phones). Audited with the
     * parent as the actor, like the unsubscribe link. Withdrawn photo consent hides the photos already
     * taken at once; the club's retention deletes them after its grace period.
     */
    async recordOwnConsent(id: string, input: OwnConsentInput) {
      const changed = await db.transaction(async (tx) => {
        // One decision at a time per child: the check below and the insert see the same history.
        await tx.select({ id: athletes.id }).from(athletes).where(eq(athletes.id, id)).for('update');
        const r = athletesRepo(tx, scope);
        const athlete = await r.get(id);
        if (!athlete) throw forbidden('You can only see the athletes linked to you.');
        const inForce = consentInForce(athlete, input.kind);
        if (inForce?.granted === input.granted) return false;
        const [row] = await r.recordConsents([{ athleteId: id, kind: input.kind, granted: input.granted, decidedOn: todayIso() }]);
        await recordAudit(tx, {
          clubId: scope.clubId,
          actorId: scope.userId,
          action: input.granted ? 'set' : 'withdraw',
          subjectKind: 'consent',
          subjectId: row!.id,
          athleteId: id,
          detail: { kind: input.kind, granted: input.granted, via: 'family page' },
        });
        return true;
      });
      return { changed, athlete: await detail(id), consents: await repo.consentHistory(id) };
    },

    async linkGuardian(id: string, input: GuardianInput) {
      await mustGet(id);
      const member = (await repo.membersByEmail([input.email])).get(input.email);
      if (!member) {
        // Invited and not joined yet: say so, rather than ask for an invitation already sent.
        const [open] = await repo.openInvitations({ email: input.email });
        const sent = open ? formatDateInWords(open.sentAt.slice(0, 10)) : '';
        const message = !open
          ? 'No one with this e-mail is in the club yet. Invite them from People as a parent or guardian first, then link them here.'
          : open.athleteIds.includes(id)
            ? `${input.email} was invited on ${sent} as a parent of this child and has not accepted yet: they are linked as soon as they accept.`
            : `${input.email} was invited on ${sent} and has not accepted yet. Link them here once they have, or cancel that invitation in People and send one that names this child.`;
        throw new AppError(400, 'not_a_member', message, { email: message });
      }
      if (member.role !== 'parent') {
        const message = `This e-mail belongs to the club’s ${ROLE_LABELS[member.role].toLowerCase()}; only parent or guardian accounts can be linked to a child.`;
        throw new AppError(400, 'not_a_parent', message, { email: message });
      }
      const linked = await repo.linkGuardians([{ athleteId: id, userId: member.userId }]);
      // Linking an account already linked changes nothing, and is not recorded again.
      if (linked.length > 0)
        await recordAudit(db, {
          clubId: scope.clubId,
          actorId: scope.userId,
          action: 'guardian.link',
          subjectKind: 'athlete',
          subjectId: id,
          athleteId: id,
          detail: { guardian: member.displayName, guardianUserId: member.userId },
        });
      return detail(id);
    },

    async unlinkGuardian(id: string, userId: string) {
      await mustGet(id);
      const name = (await repo.guardians(id)).find((g) => g.userId === userId)?.displayName;
      if (!(await repo.unlinkGuardian(id, userId))) throw notFound('This guardian link');
      await recordAudit(db, {
        clubId: scope.clubId,
        actorId: scope.userId,
        action: 'guardian.unlink',
        subjectKind: 'athlete',
        subjectId: id,
        athleteId: id,
        detail: { guardian: name ?? null, guardianUserId: userId },
      });
      return detail(id);
    },

    // --- squads -----------------------------------------------------------------------------------
    async createSquad(input: SquadInput) {
      return db.transaction(async (tx) => {
        const r = athletesRepo(tx, scope);
        await r.lockRoster();
        await refuseSquadName(r, input.name);
        return r.createSquad(input.name);
      });
    },

    async renameSquad(id: string, input: SquadInput) {
      return db.transaction(async (tx) => {
        const r = athletesRepo(tx, scope);
        await r.lockRoster();
        const squad = await r.squad(id);
        if (!squad) throw notFound('The squad');
        if (squad.archivedAt) throw conflict('This squad is archived.');
        await refuseSquadName(r, input.name, id);
        return (await r.renameSquad(id, input.name))!;
      });
    },

    async archiveSquad(id: string) {
      return db.transaction(async (tx) => {
        const r = athletesRepo(tx, scope);
        await r.lockRoster();
        const squad = await r.squad(id);
        if (!squad) throw notFound('The squad');
        if (squad.archivedAt) return squad;
        const count = await r.activeAthleteCount(id);
        if (count > 0) {
          throw conflict(`${squad.name} still has ${count} athlete${count === 1 ? '' : 's'}: move or archive them first.`);
        }
        return (await r.archiveSquad(id))!;
      });
    },
  };
}

async function refuseSquadName(r: AthletesRepo, name: string, exceptId?: string) {
  if ((await r.activeSquadsNamed(name, exceptId)).length > 0) {
    const message = 'The club already has a squad with this name.';
    throw new AppError(409, 'duplicate', message, { name: message });
  }
}

function definedOnly<T extends object>(value: T): { [K in keyof T]?: Exclude<T[K], undefined> } {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined)) as never;
}

export type AthletesService = ReturnType<typeof athletesService>;
