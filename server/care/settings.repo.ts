import { eq } from 'drizzle-orm';
import { careSettings } from '@/db/schema';
import type { CareSettingsInput } from '@/features/care/schemas';
import type { CareSettingsView } from '@/features/care/types';
import type { Executor } from '@/server/screening/screening.repo';

export const DEFAULT_CARE_SETTINGS: CareSettingsView = {
  autoReleaseDays: null,
  photoGraceDays: 30,
  photoRetentionMonths: 24,
  familyPhotos: false,
  testersReadTeamNotes: false,
};

/** A club's care settings; the defaults until an admin saves them. */
export async function careSettingsOf(db: Executor, clubId: string): Promise<CareSettingsView> {
  const [row] = await db.select().from(careSettings).where(eq(careSettings.clubId, clubId));
  if (!row) return { ...DEFAULT_CARE_SETTINGS };
  return {
    autoReleaseDays: row.autoReleaseDays,
    photoGraceDays: row.photoGraceDays,
    photoRetentionMonths: row.photoRetentionMonths,
    familyPhotos: row.familyPhotos,
    testersReadTeamNotes: row.testersReadTeamNotes,
  };
}

export async function saveCareSettings(db: Executor, clubId: string, input: CareSettingsInput): Promise<void> {
  const values = {
    autoReleaseDays: input.autoReleaseDays ?? null,
    photoGraceDays: input.photoGraceDays,
    photoRetentionMonths: input.photoRetentionMonths,
    familyPhotos: input.familyPhotos,
    testersReadTeamNotes: input.testersReadTeamNotes,
  };
  await db
    .insert(careSettings)
    .values({ clubId, ...values })
    .onConflictDoUpdate({ target: careSettings.clubId, set: values });
}
