import type { Db } from '@/db/client';
import { athletes, clubs, consents, guardianLinks, memberships, squads, users } from '@/db/schema';
import { hashPassword } from '@/server/auth/password';
import { DEMO_CLUB_NAME, DEMO_PASSWORD, DEMO_USERS, OTHER_CLUB_NAME, OTHER_CLUB_USERS } from './demo-accounts';
import { seedDemoCare } from './demo-care';
import { seedDemoScreening } from './demo-screening';
import { seedDemoTraining } from './demo-training';
import { seededRandom } from './random';

// Invented names only. Deterministic, so every fresh demo looks the same.
const FIRST_F = ['Maya', 'Aiko', 'Freya', 'Lucia', 'Nadia', 'Orla', 'Priyanka', 'Saskia', 'Tove', 'Yara', 'Zofia', 'Elin'];
const FIRST_M = ['Theo', 'Arjun', 'Bruno', 'Casper', 'Dario', 'Emil', 'Felix', 'Hugo', 'Idris', 'Jonas', 'Kai', 'Leon'];
const LAST = ['Quarrie', 'Brennan', 'Castell', 'Dahl', 'Eskola', 'Ferreira', 'Gallo', 'Haddad', 'Ishii', 'Jansen', 'Kowal', 'Lund', 'Marsh', 'Novak'];

export type DemoIds = { clubId: string; otherClubId: string; squadIds: string[]; athleteIds: string[] };

export async function seedDemo(db: Db): Promise<DemoIds> {
  const rand = seededRandom(20260901);
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  return db
    .transaction(async (tx) => {
      const [club] = await tx.insert(clubs).values({ name: DEMO_CLUB_NAME }).returning();
      const [other] = await tx.insert(clubs).values({ name: OTHER_CLUB_NAME }).returning();
      const userIds: Record<string, string> = {};
      for (const u of [...DEMO_USERS, ...OTHER_CLUB_USERS]) {
        const [row] = await tx.insert(users).values({ email: u.email, displayName: u.displayName, passwordHash }).returning();
        userIds[u.email] = row!.id;
      }
      for (const u of DEMO_USERS) await tx.insert(memberships).values({ userId: userIds[u.email]!, clubId: club!.id, role: u.role });
      for (const u of OTHER_CLUB_USERS) await tx.insert(memberships).values({ userId: userIds[u.email]!, clubId: other!.id, role: u.role });

      const squadRows = await tx
        .insert(squads)
        .values([
          { clubId: club!.id, name: 'Under-13 mixed' },
          { clubId: club!.id, name: 'Under-15 mixed' },
        ])
        .returning();
      const [otherSquad] = await tx.insert(squads).values({ clubId: other!.id, name: 'Juniors' }).returning();

      const athleteIds: string[] = [];
      const adminId = userIds['admin@squadline.test']!;
      for (const [s, squad] of squadRows.entries()) {
        const birthYear = s === 0 ? 2014 : 2012;
        for (let i = 0; i < 12; i++) {
          const female = i % 2 === 0;
          // The demo parent's two children: Maya (under-13) and Theo (under-15).
          const firstName = s === 0 && i === 0 ? 'Maya' : s === 1 && i === 1 ? 'Theo' : (female ? FIRST_F : FIRST_M)[(i + s * 5) % 12]!;
          const lastName = (s === 0 && i === 0) || (s === 1 && i === 1) ? 'Okafor' : LAST[(i * 3 + s * 7 + 1) % LAST.length]!;
          const month = 1 + Math.floor(rand() * 12);
          const day = 1 + Math.floor(rand() * 28);
          const [athlete] = await tx
            .insert(athletes)
            .values({
              clubId: club!.id,
              squadId: squad.id,
              firstName,
              lastName,
              dateOfBirth: `${birthYear + (rand() < 0.5 ? 0 : 1)}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`,
              sex: female ? 'female' : 'male',
              racketHand: rand() < 0.15 ? 'left' : 'right',
              takeOffLeg: rand() < 0.3 ? 'right' : 'left',
            })
            .returning();
          athleteIds.push(athlete!.id);
          // Two families have not (yet) agreed to photos: the product must show that clearly.
          const photos = !(s === 0 && i === 5) && !(s === 1 && i === 8);
          await tx.insert(consents).values([
            { athleteId: athlete!.id, kind: 'screening', granted: true, decidedOn: '2026-02-27', recordedBy: adminId },
            { athleteId: athlete!.id, kind: 'photos', granted: photos, decidedOn: '2026-02-27', recordedBy: adminId },
            { athleteId: athlete!.id, kind: 'email_summaries', granted: true, decidedOn: '2026-02-27', recordedBy: adminId },
          ]);
          if (lastName === 'Okafor') {
            await tx.insert(guardianLinks).values({ athleteId: athlete!.id, userId: userIds['parent@squadline.test']! });
          }
        }
      }
      const [northgateKid] = await tx
        .insert(athletes)
        .values([
          {
            clubId: other!.id,
            squadId: otherSquad!.id,
            firstName: 'Rosa',
            lastName: 'Mensah',
            dateOfBirth: '2013-04-11',
            sex: 'female',
            racketHand: 'right',
            takeOffLeg: 'left',
          },
          {
            clubId: other!.id,
            squadId: otherSquad!.id,
            firstName: 'Ewan',
            lastName: 'Pike',
            dateOfBirth: '2012-10-02',
            sex: 'male',
            racketHand: 'left',
            takeOffLeg: 'right',
          },
        ])
        .returning();
      await tx.insert(guardianLinks).values({ athleteId: northgateKid!.id, userId: userIds['parent@northgate.test']! });
      return { clubId: club!.id, otherClubId: other!.id, squadIds: squadRows.map((s) => s.id), athleteIds };
    })
    .then(async (ids) => {
      await seedDemoScreening(db, ids);
      await seedDemoCare(db, ids);
      await seedDemoTraining(db, ids);
      return ids;
    });
}
