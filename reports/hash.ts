// Hashing lives with the calc layer (revisions hash inputs + result there); the reports re-export it.
export { canonicalJson, sha256Hex } from '../lib/calc/hash'
