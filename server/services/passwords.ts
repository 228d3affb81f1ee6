import bcrypt from "bcryptjs";

/** bcrypt work factor for new hashes (≥ 10; each step doubles the cost, ~0.1 s at 11 on this class of machine). */
export const BCRYPT_COST = 11;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

/** A valid hash of a random password: compared against when the e-mail is unknown, so timing does not tell. */
export const DUMMY_HASH = bcrypt.hashSync(`no-such-user-${Math.random()}`, BCRYPT_COST);
