import type { RoleValue } from '@/features/auth/schemas';

/** Who changes the roster (the server checks the same): admins and head coaches. */
export const canManageRoster = (role: RoleValue) => role === 'admin' || role === 'head_coach';

/** Parents are not shown the other adults linked to a child. */
export const canSeeGuardians = (role: RoleValue) => role !== 'parent';
