import { can, type Role } from '@/features/access/permissions';

export type NavItem = { href: string; label: string };

/** What each role finds in the navigation: what the access table lets them open (the server checks the same). */
export function navFor(role: Role, options: { mailbox: boolean }): NavItem[] {
  const items: NavItem[] = [{ href: '/', label: 'Home' }];
  if (can(role, 'roster.read')) items.push({ href: '/athletes', label: 'Athletes' });
  if (can(role, 'screening.read')) items.push({ href: '/screening', label: 'Screening' });
  if (can(role, 'members.read')) items.push({ href: '/people', label: 'People' });
  if (can(role, 'mailbox.read') && options.mailbox) items.push({ href: '/dev/mailbox', label: 'Mailbox (local)' });
  return items;
}
