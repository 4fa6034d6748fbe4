/**
 * What a page says before the session is known: its title and, where the page's own heading does not
 * depend on who is signed in, the line under it. Shown in the pre-rendered HTML, so a phone on a slow
 * hall connection sees where it is going while the JavaScript and the session arrive. Pages whose heading
 * is this same text read it from here, so the two cannot drift apart.
 */
/** `lead`: the page shows a small line above its title (filled in once the session is known). */
export type PageHead = { title: string; text?: string; lead?: boolean };

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
  reviews: { title: 'To review' },
  people: { title: 'People' },
  audit: { title: 'Audit trail' },
} as const satisfies Record<string, PageHead>;

/** The head for a path, or null for a page whose heading comes from its data (an athlete, a round). */
export function pageHeadFor(pathname: string): PageHead | null {
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
