import { can } from '@/features/access/permissions';
import type { RoleValue } from '@/features/auth/schemas';

export type NavItem = { href: string; label: string };

/** What each role finds in the navigation. Routes still check roles on the server. */
export function navFor(role: RoleValue, options: { mailbox: boolean }): NavItem[] {
  const items: NavItem[] = [{ href: '/', label: 'Home' }];
  if (role !== 'parent') items.push({ href: '/athletes', label: 'Athletes' });
  if (role !== 'parent') items.push({ href: '/screening', label: 'Screening' });
  // The roles that screen also place the points of photos taken courtside.
  if (role === 'admin' || role === 'head_coach' || role === 'tester') items.push({ href: '/measuring', label: 'To measure' });
  if (can(role, 'trends.read')) items.push({ href: '/trends', label: 'Squad trends' });
  if (can(role, 'review.read')) items.push({ href: '/reviews', label: 'Reviews' });
  if (role === 'admin' || role === 'head_coach') items.push({ href: '/people', label: 'People' });
  if (can(role, 'audit.read')) items.push({ href: '/audit', label: 'Audit trail' });
  if (can(role, 'club.settings')) items.push({ href: '/care-settings', label: 'Care settings' });
  if (role === 'admin' && options.mailbox) items.push({ href: '/dev/mailbox', label: 'Mailbox (local)' });
  return items;
}
