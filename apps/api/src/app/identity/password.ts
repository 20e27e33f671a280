import bcrypt from 'bcryptjs';

/** bcrypt cost: 2^10 rounds, the floor the team agreed on (common practice, no source). */
const COST = 10;

export const hashPassword = (password: string): Promise<string> => bcrypt.hash(password, COST);
export const verifyPassword = (password: string, hash: string): Promise<boolean> => bcrypt.compare(password, hash);
