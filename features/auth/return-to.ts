/**
 * Where to go after signing in: the page that asked for it (a link in an e-mail, a bookmark), passed as
 * `?next=` by the club layout. Only a path of this app is followed: anything else (another origin, a
 * protocol-relative `//host`, a back-slash trick, the sign-in page itself) goes home, so the parameter
 * cannot send anyone to another site after they typed their password (our choice, common practice
 * against open redirects, no source).
 */
export function returnPath(next: unknown): string {
  if (typeof next !== 'string' || next.length > 512) return '/';
  if (!next.startsWith('/') || next.startsWith('//') || next.includes('\\')) return '/';
  if (/[\u0000-\u001f]/.test(next)) return '/';
  const path = next.split(/[?#]/)[0]!;
  if (path === '/sign-in' || path.startsWith('/sign-in/')) return '/';
  return next;
}

/**
 * Set when the person signs out on this device: the sign-in page that follows then carries no `next`,
 * so whoever signs in next on a shared phone starts at their own home, not on the page the previous
 * person left open. Cleared by the next sign-in.
 */
let signedOutHere = false;
export const rememberSignOut = (value: boolean) => {
  signedOutHere = value;
};
export const signedOutOnThisDevice = () => signedOutHere;
