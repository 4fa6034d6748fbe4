// The shapes every API answer shares, used by the server's error middleware and the app's API client.

/** Every refused or failed request: `fields` maps a form field to what is wrong with it. */
export type ApiErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

/**
 * A 409 that carries the server's current state beside the error, so the client can show or merge it
 * (a draft saved by another phone, a result re-submitted or a plan edited since the user opened it).
 */
export type ConflictBody<Current> = ApiErrorBody & { current: Current };

/** The `current` of a conflict answer, when the body is one. */
export function conflictCurrent<Current>(body: unknown): Current | null {
  if (typeof body !== 'object' || body === null || !('current' in body)) return null;
  return (body as ConflictBody<Current>).current ?? null;
}
