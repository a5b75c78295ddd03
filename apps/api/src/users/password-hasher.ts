import { Algorithm, hash, verify } from '@node-rs/argon2';

// argon2id with the library's defaults raised to OWASP's suggested minimum (19 MiB, t=2) (common practice).
const OPTIONS = { algorithm: Algorithm.Argon2id, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(plain: string): Promise<string> {
  return hash(plain, OPTIONS);
}

/** False for a wrong password or a malformed hash (never throws on bad input). */
export async function verifyPassword(hashed: string, plain: string): Promise<boolean> {
  try {
    return await verify(hashed, plain);
  } catch {
    return false;
  }
}
