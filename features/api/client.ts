// The app's one API client: cookies included, typed errors, and a hook for 401s.
// It has no UI side effects: whoever owns the session state subscribes to `onUnauthorized`.

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
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

const OFFLINE_MESSAGE = 'No connection to Squadline. Check the network and try again; nothing you typed is lost.';

export async function api<T>(path: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const headers = new Headers(init.headers);
  headers.set('Accept', 'application/json');
  if (clubId) headers.set('X-Club-Id', clubId);
  let body = init.body;
  if (init.json !== undefined) {
    headers.set('Content-Type', 'application/json');
    body = JSON.stringify(init.json);
  }
  let res: Response;
  try {
    res = await fetch(`/api${path}`, { ...init, headers, body, credentials: 'include' });
  } catch {
    throw new ApiError(0, 'offline', OFFLINE_MESSAGE);
  }
  if (res.status === 204) return undefined as T;
  const payload = (await res.json().catch(() => null)) as
    | { error?: { code: string; message: string; fields?: Record<string, string> } }
    | null;
  if (!res.ok) {
    if (res.status === 401) unauthorizedListeners.forEach((l) => l());
    const err = payload?.error;
    throw new ApiError(res.status, err?.code ?? 'http_error', err?.message ?? `The server answered ${res.status}.`, err?.fields);
  }
  return payload as T;
}
