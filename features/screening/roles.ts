import type { RoleValue } from '@/features/auth/schemas';

// Mirrors the server's screening routes: every staff role reads; these screen, submit and adjust plans.
// Parents see no screening data yet.
export const SCREENING_WRITERS: readonly RoleValue[] = ['admin', 'head_coach', 'tester'];

export const canScreen = (role: RoleValue) => SCREENING_WRITERS.includes(role);
export const canReadScreening = (role: RoleValue) => role !== 'parent';
