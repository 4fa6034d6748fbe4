import { afterEach, describe, expect, it, vi } from 'vitest';
import {
  ApiError,
  apiAssetUrl,
  apiStartedEarly,
  apiUrl,
  EARLY_REQUESTS_GLOBAL,
  fieldErrorsOf,
  forgetEarlyRequests,
  messageOf,
  showServerError,
} from './client';

describe('fieldErrorsOf', () => {
  it('returns the per-field messages of a validation error', () => {
    expect(fieldErrorsOf(new ApiError(400, 'invalid_input', 'Some fields need attention.', { email: 'Enter a valid e-mail address.' }))).toEqual({
      email: 'Enter a valid e-mail address.',
    });
  });
  it('returns null for errors without fields', () => {
    expect(fieldErrorsOf(new ApiError(409, 'conflict', 'Already a member.'))).toBeNull();
    expect(fieldErrorsOf(new Error('boom'))).toBeNull();
    expect(fieldErrorsOf('text')).toBeNull();
  });
});

describe('messageOf', () => {
  it('uses the message of an error, or the thrown value as text', () => {
    expect(messageOf(new ApiError(0, 'offline', 'No connection to Squadline.'))).toBe('No connection to Squadline.');
    expect(messageOf('plain text')).toBe('plain text');
  });
});

describe('API addresses', () => {
  it('sends JSON calls and uploads to the same base: same origin in production, the API server under npm run dev', () => {
    expect(apiUrl('/me', '')).toBe('/api/me');
    expect(apiUrl('/assessments/1/photos', 'http://localhost:8080')).toBe('http://localhost:8080/api/assessments/1/photos');
    expect(apiUrl('/me', 'http://localhost:8080/')).toBe('http://localhost:8080/api/me');
  });
  it('points photo addresses from the server at the API server, and leaves other addresses alone', () => {
    expect(apiAssetUrl('/api/photos/9?size=thumb', 'http://localhost:8080')).toBe('http://localhost:8080/api/photos/9?size=thumb');
    expect(apiAssetUrl('/api/photos/9?size=thumb', '')).toBe('/api/photos/9?size=thumb');
    expect(apiAssetUrl('blob:http://localhost:8081/abc', 'http://localhost:8080')).toBe('blob:http://localhost:8081/abc');
  });
});

describe('showServerError', () => {
  const form = () => {
    const seen: { errors?: Record<string, string>; status?: string } = {};
    return { seen, setErrors: (fields: Record<string, string>) => (seen.errors = fields), setStatus: (status: string) => (seen.status = status) };
  };
  it('puts field errors beside their fields', () => {
    const f = form();
    showServerError(new ApiError(400, 'invalid_input', 'Some fields need attention.', { detail: 'Say what to change.' }), f);
    expect(f.seen).toEqual({ errors: { detail: 'Say what to change.' } });
  });
  it('shows any other refusal as the form message', () => {
    const f = form();
    showServerError(new ApiError(403, 'forbidden', 'You do not have access to this.'), f);
    expect(f.seen).toEqual({ status: 'You do not have access to this.' });
  });
});

describe('answers the page asked for from its HTML', () => {
  const g = globalThis as Record<string, unknown>;
  const json = (body: unknown, status = 200) => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
  afterEach(() => {
    delete g[EARLY_REQUESTS_GLOBAL];
    vi.unstubAllGlobals();
    vi.restoreAllMocks();
  });

  it('takes an early answer once, then asks the network', async () => {
    g[EARLY_REQUESTS_GLOBAL] = { '/assessments/a': Promise.resolve(json({ from: 'page' })) };
    const fetchMock = vi.fn(async () => json({ from: 'network' }));
    vi.stubGlobal('fetch', fetchMock);
    expect(await apiStartedEarly('/assessments/a')).toEqual({ from: 'page' });
    expect(fetchMock).not.toHaveBeenCalled();
    expect(await apiStartedEarly('/assessments/a')).toEqual({ from: 'network' });
    expect(fetchMock).toHaveBeenCalledTimes(1);
  });

  it('asks again when the page has been open longer than EARLY_FRESH_MS', async () => {
    g[EARLY_REQUESTS_GLOBAL] = { '/me': Promise.resolve(json({ from: 'page' })) };
    vi.spyOn(performance, 'now').mockReturnValue(61_000);
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => json({ from: 'network' })),
    );
    expect(await apiStartedEarly('/me')).toEqual({ from: 'network' });
  });

  it("asks again with the app's headers when the page's answer was a refusal other than signed out", async () => {
    const severalClubs = json({ error: { code: 'invalid_input', message: 'You belong to several clubs: choose one (X-Club-Id header).' } }, 400);
    g[EARLY_REQUESTS_GLOBAL] = {
      '/assessments/a': Promise.resolve(severalClubs),
      '/me': Promise.resolve(json({ error: { code: 'unauthorized', message: 'Sign in.' } }, 401)),
    };
    const fetchMock = vi.fn(async () => json({ from: 'network' }));
    vi.stubGlobal('fetch', fetchMock);
    expect(await apiStartedEarly('/assessments/a')).toEqual({ from: 'network' });
    expect(fetchMock).toHaveBeenCalledTimes(1);
    // Signed out is signed out in every club: that answer is taken as it is.
    await expect(apiStartedEarly('/me')).rejects.toMatchObject({ status: 401 });
    expect(fetchMock).toHaveBeenCalledTimes(1);
  });

  it('forgets every early answer after a signed-out /me (a refused assessment is not kept for after sign-in)', async () => {
    g[EARLY_REQUESTS_GLOBAL] = { '/assessments/a': Promise.resolve(json({ error: { code: 'unauthorized', message: 'Sign in.' } }, 401)) };
    forgetEarlyRequests();
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => json({ from: 'network' })),
    );
    expect(await apiStartedEarly('/assessments/a')).toEqual({ from: 'network' });
  });
});
