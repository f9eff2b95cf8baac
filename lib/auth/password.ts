import bcrypt from "bcryptjs";

/** Cost 10 or more, as the stack requires; 12 keeps a sign-in under ~250 ms on this machine class. */
export const BCRYPT_COST = 12;

export function hashPassword(plain: string, cost = BCRYPT_COST): Promise<string> {
  return bcrypt.hash(plain, cost);
}

export function verifyPassword(plain: string, hash: string): Promise<boolean> {
  return bcrypt.compare(plain, hash);
}
