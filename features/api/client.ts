import type { ApiErrorBody } from './contract';

// The app's one API client: cookies included, typed errors, and a hook for 401s.
// It has no UI side effects: whoever owns the session state subscribes to `onUnauthorized`.

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    /** The whole response body, for errors that carry data (a 409 with the server's current state). */
    readonly body?: unknown,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

type Listener = () => void;
const unauthorizedListeners = new Set<Listener>();

/** Called whenever the server answers 401 (session gone or expired). Returns an unsubscribe. */
export function onUnauthorized(listener: Listener): () => void {
  unauthorizedListeners.add(listener);
  return () => unauthorizedListeners.delete(listener);
}

let clubId: string | null = null;
/** The club the signed-in person is working in, sent with every request. */
export function setActiveClub(id: string | null): void {
  clubId = id;
}

// Empty in production (same origin); `npm run dev` points it at the API server. Every request, JSON
// or upload, is built by `apiUrl` so the two can never go to different servers again.
const API_BASE = process.env.EXPO_PUBLIC_API_URL ?? '';

/** The full address of an API path (`/me` gives `<base>/api/me`). */
export function apiUrl(path: string, base: string = API_BASE): string {
  return `${base.replace(/\/+$/, '')}/api${path}`;
}

/** An address the server handed out (`/api/photos/...`), made to reach the API server too. */
export function apiAssetUrl(url: string, base: string = API_BASE): string {
  return url.startsWith('/api/') ? `${base.replace(/\/+$/, '')}${url}` : url;
}

const OFFLINE_MESSAGE = 'No connection to Squadline. Check the network and try again; nothing you typed is lost.';

type ErrorPayload = Partial<ApiErrorBody> | null;

function toApiError(status: number, payload: ErrorPayload): ApiError {
  if (status === 401) unauthorizedListeners.forEach((l) => l());
  const err = payload?.error;
  return new ApiError(status, err?.code ?? 'http_error', err?.message ?? `The server answered ${status}.`, err?.fields, payload ?? undefined);
}

/** Headers of a change sent from the device's outbox: its idempotency key and its club. */
export function sentFromDevice(options: { idempotencyKey?: string; clubId?: string }): Record<string, string> {
  const headers: Record<string, string> = {};
  if (options.idempotencyKey) headers['Idempotency-Key'] = options.idempotencyKey;
  if (options.clubId) headers['X-Club-Id'] = options.clubId;
  return headers;
}

export async function api<T>(path: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const headers = new Headers(init.headers);
  headers.set('Accept', 'application/json');
  // A change queued on this device carries the club it was made in.
  if (clubId && !headers.has('X-Club-Id')) headers.set('X-Club-Id', clubId);
  let body = init.body;
  if (init.json !== undefined) {
    headers.set('Content-Type', 'application/json');
    body = JSON.stringify(init.json);
  }
  let res: Response;
  try {
    res = await fetch(apiUrl(path), { ...init, headers, body, credentials: 'include' });
  } catch {
    throw new ApiError(0, 'offline', OFFLINE_MESSAGE);
  }
  return resultOf<T>(res);
}

async function resultOf<T>(res: Response): Promise<T> {
  if (res.status === 204) return undefined as T;
  const payload = (await res.json().catch(() => null)) as ErrorPayload;
  if (!res.ok) throw toApiError(res.status, payload);
  return payload as T;
}

/**
 * Functions a pre-rendered page's head queues for the moment its scripts start, once the page has been
 * painted (the start script written into each page by server/dev/route-chunks.mjs runs them).
 */
export const START_QUEUE_GLOBAL = '__squadlineOnStart';

/** The requests each pre-rendered page starts before the app's JavaScript has loaded (app/+html.tsx). */
export const EARLY_REQUESTS_GLOBAL = '__squadlineEarly';
type EarlyRequests = Record<string, Promise<Response | null> | undefined>;

/**
 * An answer the page asked for is only taken while the page is opening (time since the navigation
 * began): a screen opened later asks again, so it never shows what was true a minute ago (our choice).
 */
export const EARLY_FRESH_MS = 60_000;

const earlyRequests = () => (globalThis as { [EARLY_REQUESTS_GLOBAL]?: EarlyRequests })[EARLY_REQUESTS_GLOBAL];

/**
 * `api(path)` for a GET the page already started from its HTML: the answer is used once (the first
 * screen's), later calls go to the network. Same errors as `api`. Only where the API shares the page's
 * origin (not under `npm run dev`). The page asks before the app knows the active club, so it sends no
 * `X-Club-Id`: a refusal other than "signed out" (someone in several clubs gets a 400 asking which) is
 * not taken; the app asks again with its own headers.
 */
export async function apiStartedEarly<T>(path: string): Promise<T> {
  const early = earlyRequests();
  const started = API_BASE === '' ? early?.[path] : undefined;
  if (!started) return api<T>(path);
  delete early![path];
  if (typeof performance !== 'undefined' && performance.now() > EARLY_FRESH_MS) return api<T>(path);
  const res = await started;
  return res && (res.ok || res.status === 401) ? resultOf<T>(res) : api<T>(path);
}

/** Drops the answers the page asked for: signed out, they were refused, and after signing in they would be wrong. */
export function forgetEarlyRequests(): void {
  const early = earlyRequests();
  if (early) for (const path of Object.keys(early)) delete early[path];
}

/**
 * A multipart upload with progress (fetch cannot report upload progress). Same conventions as `api`:
 * cookies included, the active club sent, the same typed errors.
 */
export function upload<T>(
  path: string,
  form: FormData,
  options: { onProgress?: (fraction: number) => void; signal?: AbortSignal; headers?: Record<string, string> } = {},
): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', apiUrl(path));
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    const extra = options.headers ?? {};
    if (clubId && !('X-Club-Id' in extra)) xhr.setRequestHeader('X-Club-Id', clubId);
    for (const [name, value] of Object.entries(extra)) xhr.setRequestHeader(name, value);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && e.total > 0) options.onProgress?.(e.loaded / e.total);
    };
    xhr.onload = () => {
      let payload: unknown = null;
      try {
        payload = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        payload = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve(payload as T);
      else reject(toApiError(xhr.status, payload as ErrorPayload));
    };
    xhr.onerror = () => reject(new ApiError(0, 'offline', OFFLINE_MESSAGE));
    xhr.ontimeout = () => reject(new ApiError(0, 'offline', OFFLINE_MESSAGE));
    xhr.onabort = () => reject(new ApiError(0, 'aborted', 'The upload was stopped.'));
    options.signal?.addEventListener('abort', () => xhr.abort());
    xhr.send(form);
  });
}

/** The per-field messages a 400 carries, for a form to show beside its fields; null for any other error. */
export function fieldErrorsOf(error: unknown): Record<string, string> | null {
  return error instanceof ApiError && error.fields ? error.fields : null;
}

/** A message fit to show a person, whatever was thrown. */
export function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/** A refused form submit on the form: the server's field errors beside their fields, anything else as the form's message. */
export function showServerError(error: unknown, form: { setErrors: (fields: Record<string, string>) => void; setStatus: (status: string) => void }): void {
  const fields = fieldErrorsOf(error);
  if (fields) form.setErrors(fields);
  else form.setStatus(messageOf(error));
}
