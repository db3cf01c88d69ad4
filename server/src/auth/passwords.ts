import bcrypt from 'bcryptjs';

/** bcrypt compares at most 72 bytes of a password; longer ones are refused rather than silently cut. */
export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_BYTES = 72;

export function hashPassword(password: string, rounds: number): Promise<string> {
  return bcrypt.hash(password, rounds);
}

/** A hash of a password nobody knows: unknown user names cost one comparison too, so timing does not tell them apart. */
const decoyHash = bcrypt.hashSync('decoy-password-that-never-matches', 10);

/** Whether the password matches the stored hash; compares against a decoy when there is no stored hash. */
export async function verifyPassword(password: string, hash: string | undefined): Promise<boolean> {
  const matches = await bcrypt.compare(password, hash ?? decoyHash);
  return matches && hash !== undefined;
}
