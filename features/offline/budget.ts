// The device storage budget for photos taken without a connection. Pure.
//
// A scaled photo (long side 1600 px, JPEG at 0.85) weighs about 150-400 KB. 80 MB holds a whole squad
// (12 athletes x 9 tasks x 2 views at the heaviest, about 85 MB, is more than one session ever takes)
// while staying far below what browsers give a site on a phone (our choice).
export const PHOTO_BUDGET_BYTES = 80 * 1024 * 1024;

/** Warn once the photos waiting on the device use this share of the budget (our choice). */
export const PHOTO_BUDGET_WARN_FRACTION = 0.8;

export type BudgetCheck = { ok: true; usedBytes: number; afterBytes: number; warn: boolean } | { ok: false; usedBytes: number; message: string };

const mb = (bytes: number) => `${(bytes / (1024 * 1024)).toFixed(1)} MB`;

/** Whether one more photo of `bytes` fits in the budget next to `usedBytes` already waiting. */
export function checkPhotoBudget(usedBytes: number, bytes: number, budget = PHOTO_BUDGET_BYTES): BudgetCheck {
  if (!Number.isFinite(bytes) || bytes < 0 || !Number.isFinite(usedBytes) || usedBytes < 0) {
    return { ok: false, usedBytes, message: 'This photo could not be measured. Take it again.' };
  }
  const afterBytes = usedBytes + bytes;
  if (afterBytes > budget) {
    return {
      ok: false,
      usedBytes,
      message: `This phone already holds ${mb(usedBytes)} of photos waiting to upload (the limit is ${mb(budget)}). Connect to send them before taking more.`,
    };
  }
  return { ok: true, usedBytes, afterBytes, warn: afterBytes >= budget * PHOTO_BUDGET_WARN_FRACTION };
}

/** "12.4 of 80 MB" for the status panel. */
export function budgetText(usedBytes: number, budget = PHOTO_BUDGET_BYTES): string {
  return `${(usedBytes / (1024 * 1024)).toFixed(1)} of ${Math.round(budget / (1024 * 1024))} MB`;
}
