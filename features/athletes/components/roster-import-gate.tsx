import { useActiveClub } from '@/features/session/active-club';
import { Notice } from '@/features/ui/components/notice';
import { canManageRoster } from '../roles';
import { RosterImport } from './roster-import';

export function RosterImportGate() {
  const { membership } = useActiveClub();
  if (!canManageRoster(membership.role)) return <Notice>Only the club admin and head coaches import athletes.</Notice>;
  return <RosterImport />;
}
