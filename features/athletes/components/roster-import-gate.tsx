import { can } from '@/features/access/permissions';
import { useActiveClub } from '@/features/session/active-club';
import { Notice } from '@/features/ui/components/notice';
import { RosterImport } from './roster-import';

export function RosterImportGate() {
  const { membership } = useActiveClub();
  if (!can(membership.role, 'roster.manage')) return <Notice>Only the club admin and head coaches import athletes.</Notice>;
  return <RosterImport />;
}
