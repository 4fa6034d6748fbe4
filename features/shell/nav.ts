import { can, type Role } from '@/features/access/permissions';

export type NavItem = { href: string; label: string };

/** What each role finds in the navigation: what the access table lets them open (the server checks the same). */
export function navFor(role: Role, options: { mailbox: boolean }): NavItem[] {
  const items: NavItem[] = [{ href: '/', label: 'Home' }];
  if (can(role, 'roster.read')) items.push({ href: '/athletes', label: 'Athletes' });
  if (can(role, 'screening.read')) items.push({ href: '/screening', label: 'Screening' });
  if (can(role, 'screening.write')) items.push({ href: '/measuring', label: 'To measure' });
  if (can(role, 'trends.read')) items.push({ href: '/trends', label: 'Squad trends' });
  if (can(role, 'training.read')) items.push({ href: '/training', label: 'Training sheet' });
  if (can(role, 'review.read')) items.push({ href: '/reviews', label: 'Reviews' });
  if (can(role, 'members.read')) items.push({ href: '/people', label: 'People' });
  if (can(role, 'audit.read')) items.push({ href: '/audit', label: 'Audit trail' });
  if (can(role, 'club.settings')) items.push({ href: '/care-settings', label: 'Care settings' });
  // The local mailbox is a development tool: last.
  if (can(role, 'mailbox.read') && options.mailbox) items.push({ href: '/dev/mailbox', label: 'Mailbox (local)' });
  return items;
}
