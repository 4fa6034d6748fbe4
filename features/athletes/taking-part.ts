/**
 * Whether an athlete takes part in screening and corrective exercises, from the family's decision in
 * force: agreed, said no, or nothing recorded yet (not screened either way). Our wording, one set of words
 * for every screen that says it.
 */
export type TakingPart = 'yes' | 'refused' | 'unrecorded';

/** Short tags for lists (rounds, the roster). */
export const TAKING_PART_TAGS: Record<Exclude<TakingPart, 'yes'>, string> = {
  refused: 'Family said no to screening',
  unrecorded: 'No screening consent yet',
};

/** For lines that say what follows: no screen, no corrective exercise. */
export const TAKING_PART_WORDS: Record<Exclude<TakingPart, 'yes'>, string> = {
  refused: 'the family said no to screening and corrective exercises',
  unrecorded: 'no decision from the family about screening and corrective exercises is recorded yet',
};
