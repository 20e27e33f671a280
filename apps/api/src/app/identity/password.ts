import bcrypt from 'bcryptjs';

/** bcrypt cost: 2^10 rounds, the floor the team agreed on (common practice, no source). */
const COST = 10;

export const hashPassword = (password: string): Promise<string> => bcrypt.hash(password, COST);
export const verifyPassword = (password: string, hash: string): Promise<boolean> => bcrypt.compare(password, hash);

/**
 * A bcrypt hash of a random secret nobody knows, at the same cost as real ones. Signing in with
 * an unknown e-mail checks the password against it, so the answer takes as long as for a real
 * account with a wrong password and its timing does not reveal which e-mails exist.
 */
const NOBODYS_HASH = '$2b$10$sGPmJ.Qqg4gP7VKHugaHaentw6LcC0lJrYBpgGgZAlXQRenaVCqc6';

/** Checks a password against a person's hash, or (no such person) spends the same time and says no. */
export async function verifyPasswordOf(person: { passwordHash: string } | undefined, password: string): Promise<boolean> {
  const matches = await verifyPassword(password, person?.passwordHash ?? NOBODYS_HASH);
  return person !== undefined && matches;
}
