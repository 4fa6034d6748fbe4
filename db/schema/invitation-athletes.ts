import { index, pgTable, primaryKey, uuid } from 'drizzle-orm/pg-core';
import { athletes } from './athletes';
import { invitations } from './clubs';

/**
 * The children a parent's invitation links on acceptance; named in the e-mail and on the invitation page.
 * Keyed by the invitation's id: its token hash changes each time the e-mail is sent.
 */
export const invitationAthletes = pgTable(
  'invitation_athletes',
  {
    invitationId: uuid('invitation_id')
      .notNull()
      .references(() => invitations.id, { onDelete: 'cascade' }),
    athleteId: uuid('athlete_id')
      .notNull()
      .references(() => athletes.id, { onDelete: 'cascade' }),
  },
  (t) => [primaryKey({ columns: [t.invitationId, t.athleteId] }), index('invitation_athletes_athlete_idx').on(t.athleteId)],
);
