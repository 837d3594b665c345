import { hash, verify } from '@node-rs/argon2'

// @node-rs/argon2 defaults to Argon2id; parameters follow OWASP's minimum for argon2id (common practice).
const OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1 }

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS)
}

export function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  return verify(passwordHash, password)
}
