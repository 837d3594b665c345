/** @deprecated The result shapes live in lib/contract; import them from `@/lib/contract`. */
export type * from '@/lib/contract'
