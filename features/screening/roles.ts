import type { RoleValue } from '@/features/auth/schemas';

// Mirrors the server's screening routes: every staff role reads; these screen, submit and adjust plans.
// Parents see no screening data yet.
export const SCREENING_WRITERS: readonly RoleValue[] = ['admin', 'head_coach', 'tester'];

export const canScreen = (role: RoleValue) => SCREENING_WRITERS.includes(role);
export const canReadScreening = (role: RoleValue) => role !== 'parent';

/** Who may adjust a plan within the limits: the screeners, and the physiotherapist. */
export const PLAN_ADJUSTERS: readonly RoleValue[] = ['admin', 'head_coach', 'tester', 'physio'];
/** Who may go past a youth or growth-spurt limit (always with a reason): a head coach or a physiotherapist. */
export const PLAN_OVERRIDERS: readonly RoleValue[] = ['head_coach', 'physio'];

export const canAdjustPlan = (role: RoleValue) => PLAN_ADJUSTERS.includes(role);
export const canOverrideLimits = (role: RoleValue) => PLAN_OVERRIDERS.includes(role);
