import type { Role } from '@/features/access/permissions';

/**
 * Each role's home: its title and the line under it (after "Hello <first name>."). Kept short: the
 * pre-rendered head of the home (`PAGE_HEADS.home`) must stay the largest text painted, or a phone
 * counts the greeting, drawn only after the JavaScript and the session, as the page's main content
 * (Largest Contentful Paint; `intros.test.ts`).
 */
export const HOME_INTROS: Record<Role, { title: string; text: string }> = {
  admin: { title: 'Club set-up', text: 'Squads, people and consent records for the club.' },
  head_coach: { title: 'Squad overview', text: 'Your squads at a glance.' },
  tester: { title: 'Courtside', text: 'Pick a squad, then screen one athlete after another.' },
  physio: { title: 'Athlete review', text: "Screens to review, and the club's athletes." },
  parent: { title: 'Your family', text: 'What your child does in screening and training, and why.' },
};

/** The greeting line of a home, as the page shows it. */
export const homeGreeting = (firstName: string, role: Role) => `Hello ${firstName}. ${HOME_INTROS[role].text}`;
