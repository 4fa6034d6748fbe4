import { describe, expect, it } from 'vitest';
import { CallerGone, HASH_CONCURRENCY, hashPassword, verifyPassword } from './password';

describe('password hashing lane', () => {
  it('verifies a right and a wrong password', async () => {
    const hash = await hashPassword('a long enough password');
    expect(await verifyPassword(hash, 'a long enough password')).toBe(true);
    expect(await verifyPassword(hash, 'another password')).toBe(false);
  });

  it('skips the hash of a caller who left while waiting, and still verifies the others', async () => {
    const hash = await hashPassword('a long enough password');
    // Fill the lane, then queue one whose caller leaves before its turn.
    const ahead = Array.from({ length: HASH_CONCURRENCY }, () => verifyPassword(hash, 'a long enough password'));
    const leaving = new AbortController();
    const skipped = verifyPassword(hash, 'a long enough password', leaving.signal);
    leaving.abort();
    await expect(skipped).rejects.toBeInstanceOf(CallerGone);
    expect(await Promise.all(ahead)).toEqual(Array(HASH_CONCURRENCY).fill(true));
  });
});
