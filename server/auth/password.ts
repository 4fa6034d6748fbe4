import { Argon2id } from 'oslo/password';
import pLimit from 'p-limit';

const argon2id = new Argon2id();

/**
 * Argon2id runs in libuv's thread pool (4 threads unless UV_THREADPOOL_SIZE says otherwise), the same
 * threads that the database driver needs to open a connection (its SCRAM handshake derives a key
 * there), and that file writes and sharp use. Fifty sign-ins at once used to queue fifty hashes there:
 * a new database connection then waited behind all of them (measured: 9.6 s behind 100 hashes, 40 ms
 * without), past the pool's connection timeout, and the request was answered "database unavailable".
 * So at most two hashes run at once per process and the rest wait here, in JavaScript, leaving the
 * other threads free. Two of four: our choice (sign-in is bound by CPU either way on a small server).
 */
export const HASH_CONCURRENCY = 2;
const hashing = pLimit(HASH_CONCURRENCY);

export const hashPassword = (password: string) => hashing(() => argon2id.hash(password));
export const verifyPassword = (hash: string, password: string) => hashing(() => argon2id.verify(hash, password));

// Verifying against a fixed hash when the e-mail is unknown keeps the timing alike for both cases,
// so the response time does not reveal whether an account exists.
let decoy: Promise<string> | null = null;
export async function verifyDecoy(password: string): Promise<void> {
  decoy ??= hashPassword('decoy-password-never-used');
  await verifyPassword(await decoy, password);
}
