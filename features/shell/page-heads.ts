/**
 * What a page says before the session is known: its title and, where the page's own heading does not
 * depend on who is signed in, the line under it. Shown in the pre-rendered HTML, so a phone on a slow
 * hall connection sees where it is going while the JavaScript and the session arrive. Pages whose heading
 * is this same text read it from here, so the two cannot drift apart.
 */
/**
 * `lead`: the page shows a small line above its title (filled in once the session or the data is known).
 * `back`: the page starts with a link back to its list, under this label.
 */
export type PageHead = { title: string; text?: string; lead?: boolean; back?: string };

export const PAGE_HEADS = {
  home: {
    lead: true,
    title: 'Home',
    text: 'Your squads, rounds and athletes, as your role in the club sees them: what to screen next, what waits for review, and how each squad is doing.',
  },
  screening: { title: 'Screening', text: 'Rounds by squad. Open a round, then screen one athlete after another.' },
  measuring: { title: 'To measure' },
  athletes: { title: 'Athletes' },
  squads: { title: 'Squads' },
  trends: { title: 'Squad trends' },
  training: { title: 'Training sheet' },
  reviews: { title: 'To review' },
  people: { title: 'People' },
  audit: { title: 'Audit trail' },
  // A round (`/screening/rounds/:id`): the squad and date above and the round's name come with its data;
  // the title until then is this one. The line under it stays.
  round: {
    back: '← All rounds',
    lead: true,
    title: 'Round',
    text: "The round's athletes in name order, with how far each screen has got and, once it is submitted, what it flagged. Tap a name to open it.",
  },
} as const satisfies Record<string, PageHead>;

const ROUND_PATH = /^\/screening\/rounds\/[^/]+\/?$/;

/** The head for a path, or null for a page whose heading comes from its data (an athlete, a result). */
export function pageHeadFor(pathname: string): PageHead | null {
  if (ROUND_PATH.test(pathname)) return PAGE_HEADS.round;
  const first = pathname.split('/').filter(Boolean)[0] ?? '';
  const rest = pathname.split('/').filter(Boolean).length > 1;
  if (first === '') return PAGE_HEADS.home;
  if (rest) return null;
  return (PAGE_HEADS as Record<string, PageHead>)[first] ?? null;
}

/**
 * The capture screen (`/screening/assessments/:id`) has a frame of its own instead of a page head: the
 * head band, the step and Back and Next (CaptureFrame), so its pre-rendered HTML shows where the tester
 * is going and nothing moves when the assessment arrives.
 */
export function isCapturePath(pathname: string): boolean {
  return /^\/screening\/assessments\/[^/]+\/?$/.test(pathname);
}
