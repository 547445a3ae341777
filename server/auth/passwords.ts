import bcrypt from 'bcryptjs';

/** bcrypt hash with the configured cost (≥ 12 in production). */
export function hashPassword(password: string, cost: number): Promise<string> {
  return bcrypt.hash(password, cost);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

