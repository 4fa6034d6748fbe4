import { Argon2id } from 'oslo/password';

const argon2id = new Argon2id();

export const hashPassword = (password: string) => argon2id.hash(password);
export const verifyPassword = (hash: string, password: string) => argon2id.verify(hash, password);

// Verifying against a fixed hash when the e-mail is unknown keeps the timing alike for both cases,
// so the response time does not reveal whether an account exists.
let decoy: Promise<string> | null = null;
export async function verifyDecoy(password: string): Promise<void> {
  decoy ??= argon2id.hash('decoy-password-never-used');
  await argon2id.verify(await decoy, password);
}
