import { createHash, createPrivateKey, createPublicKey, generateKeyPairSync, sign, verify, type KeyObject } from 'node:crypto'
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import path from 'node:path'
import { canonicalJson } from '@/lib/calc/hash'

/*
 * The server's Ed25519 key signs every signing transition (check, approve, issue, void): the
 * statement names the revision, its content hash, the action, the person and the time. The key is
 * made on first use and kept in the data folder (shared by every instance); its public key is shown
 * on the about page so anyone can verify a statement without trusting this server's database.
 */

function keyDir(): string {
  return process.env.SIGNING_KEY_DIR || path.join(process.cwd(), 'data', 'keys')
}

let cached: { privateKey: KeyObject; publicKey: KeyObject; dir: string } | null = null

function keys() {
  const dir = keyDir()
  if (cached?.dir === dir) return cached
  const file = path.join(/*turbopackIgnore: true*/ dir, 'signing-ed25519.pem')
  mkdirSync(dir, { recursive: true })
  try {
    // 'wx': of two instances starting at once, one writes the key and the other reads it.
    const { privateKey } = generateKeyPairSync('ed25519')
    writeFileSync(file, privateKey.export({ type: 'pkcs8', format: 'pem' }), { flag: 'wx', mode: 0o600 })
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err
  }
  const privateKey = createPrivateKey(readFileSync(file))
  cached = { privateKey, publicKey: createPublicKey(privateKey), dir }
  return cached
}

/** PEM of the public key, for the about page. */
export function publicKeyPem(): string {
  return keys().publicKey.export({ type: 'spki', format: 'pem' }).toString()
}

/** SHA-256 fingerprint of the public key (hex, grouped), to compare by eye. */
export function publicKeyFingerprint(): string {
  const der = keys().publicKey.export({ type: 'spki', format: 'der' })
  return createHash('sha256').update(der).digest('hex').match(/.{4}/g)!.slice(0, 8).join(' ')
}

export interface SignedStatement {
  statement: string
  signature: string
}

/** Signs the canonical JSON of `statement`; returns both, as stored in the revision history. */
export function signStatement(statement: Record<string, unknown>): SignedStatement {
  const text = canonicalJson(statement)
  return { statement: text, signature: sign(null, Buffer.from(text), keys().privateKey).toString('base64') }
}

export function verifyStatement(statement: string, signature: string): boolean {
  try {
    return verify(null, Buffer.from(statement), keys().publicKey, Buffer.from(signature, 'base64'))
  } catch {
    return false
  }
}

const CROCKFORD = '0123456789ABCDEFGHJKMNPQRSTVWXYZ'

/** A short code printed on an issued package (10 characters of Crockford base32 from the signature). */
export function verificationCodeOf(signature: string): string {
  const digest = createHash('sha256').update(signature).digest()
  let bits = 0
  let value = 0
  let out = ''
  for (const byte of digest) {
    value = (value << 8) | byte
    bits += 8
    while (bits >= 5 && out.length < 10) {
      out += CROCKFORD[(value >>> (bits - 5)) & 31]
      bits -= 5
    }
  }
  return `${out.slice(0, 5)}-${out.slice(5, 10)}`
}

/** Reads a code as typed: case, spaces and the usual look-alikes (O→0, I/L→1) do not matter. */
export function normaliseCode(raw: string): string {
  const s = raw.toUpperCase().replace(/[\s-]/g, '').replace(/O/g, '0').replace(/[IL]/g, '1')
  return s.length === 10 ? `${s.slice(0, 5)}-${s.slice(5)}` : s
}
