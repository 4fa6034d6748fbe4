import { index, pgTable, primaryKey, text, uuid } from 'drizzle-orm/pg-core';
import { athletes } from './athletes';
import { invitations } from './clubs';

/** The children a parent's invitation links on acceptance; named in the e-mail and on the invitation page. */
export const invitationAthletes = pgTable(
  'invitation_athletes',
  {
    tokenHash: text('token_hash')
      .notNull()
      .references(() => invitations.tokenHash, { onDelete: 'cascade' }),
    athleteId: uuid('athlete_id')
      .notNull()
      .references(() => athletes.id, { onDelete: 'cascade' }),
  },
  (t) => [primaryKey({ columns: [t.tokenHash, t.athleteId] }), index('invitation_athletes_athlete_idx').on(t.athleteId)],
);
