import type { TaskDraft } from '@/features/screening/contract';
import type { TaskId } from '@/features/screening/engine';
import { BATTERY } from '@/features/screening/engine/battery';

/** The battery's landing task: the one a hold on landing work keeps an athlete from (our choice). */
export const LANDING_TASK: TaskId = 'drop-landing';

/**
 * The tasks of this screen, before `taskId` in the battery's order, where pain was ticked (the landing task
 * is held after them, as the plan will hold landing work; our choice: a task already run before the pain is
 * not asked to be skipped).
 */
export function painEarlierToday(tasks: Partial<Record<TaskId, TaskDraft>>, taskId: TaskId): TaskId[] {
  const at = BATTERY.findIndex((t) => t.id === taskId);
  return BATTERY.slice(0, Math.max(0, at))
    .filter((t) => tasks[t.id]?.painReported === true)
    .map((t) => t.id);
}

/** The tasks on hold today for the review: those held from earlier screens, and the landing task after pain ticked in this one. */
export function heldWithPainToday(held: readonly TaskId[], tasks: Partial<Record<TaskId, TaskDraft>>): TaskId[] {
  return painEarlierToday(tasks, LANDING_TASK).length > 0 && !held.includes(LANDING_TASK) ? [...held, LANDING_TASK] : [...held];
}
