import type { PhotoFile } from '@/features/screening/api/upload-photo';

/** Longest side sent to the server: enough to place landmarks, small enough for a sports-hall network. */
export const MAX_LONG_SIDE = 1600;

export type ScaledPhoto = { file: PhotoFile; previewUri: string; width: number; height: number };
