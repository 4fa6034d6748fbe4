import { Argon2id } from 'oslo/password';
import pLimit from 'p-limit';
import { AppError } from '@/server/http/errors';

const argon2id = new Argon2id();

/**
 * Argon2id runs in libuv's thread pool (4 threads unless UV_THREADPOOL_SIZE says otherwise), the same
 * threads that the database driver needs to open a connection (its SCRAM handshake derives a key
 * there), and that file writes and sharp use. Fifty sign-ins at once used to queue fifty hashes there:
 * a new database connection then waited behind all of them (measured: 9.6 s behind 100 hashes, 40 ms
 * without), past the pool's connection timeout, and the request was answered "database unavailable".
 * So at most two hashes run at once per process and the rest wait here, in JavaScript, leaving the
 * other threads free; a sign-in whose caller has gone away meanwhile is not hashed at all. Two of four: our choice (sign-in is bound by CPU either way on a small server).
 */
export const HASH_CONCURRENCY = 2;
const hashing = pLimit(HASH_CONCURRENCY);

/** The caller went away while its hash waited for its turn: the work is skipped, nobody would read the answer. */
export class CallerGone extends AppError {
  constructor() {
    super(499, 'caller_gone', 'The request was abandoned before it was handled.');
  }
}

/** Runs `work` in its turn, unless `signal` says the caller left while it waited. */
const inTurn = <T>(work: () => Promise<T>, signal?: AbortSignal) =>
  hashing(() => {
    if (signal?.aborted) throw new CallerGone();
    return work();
  });

export const hashPassword = (password: string) => inTurn(() => argon2id.hash(password));
export const verifyPassword = (hash: string, password: string, signal?: AbortSignal) => inTurn(() => argon2id.verify(hash, password), signal);

// Verifying against a fixed hash when the e-mail is unknown keeps the timing alike for both cases,
// so the response time does not reveal whether an account exists.
let decoy: Promise<string> | null = null;
export async function verifyDecoy(password: string, signal?: AbortSignal): Promise<void> {
  decoy ??= hashPassword('decoy-password-never-used');
  await verifyPassword(await decoy, password, signal);
}
