/** Password hashing with bcrypt (bcryptjs, pure JavaScript). */
import bcrypt from 'bcryptjs';

/** A hash that no password matches, compared against when the account is unknown so timing does not reveal it. */
const DUMMY_HASH = '$2b$10$C6UzMDM.H6dfI/f/IKxGhuM0Z1m1rGkZ9vlGc1kyjGvY7R2Jc4yKa';

/** Hashes a password with the given cost. */
export async function hashPassword(password: string, rounds: number): Promise<string> {
  return bcrypt.hash(password, rounds);
}

/** Checks a password against a hash (or against a dummy when the hash is null). */
export async function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  const ok = await bcrypt.compare(password, hash ?? DUMMY_HASH);
  return ok && hash !== null;
}
