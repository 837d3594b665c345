/**
 * Numbers in the engine's steps and messages: the one formatter of lib/units (four significant
 * figures, whole numbers from 1000 up, powers of ten below 10⁻³). The `digits` argument of
 * earlier versions is gone: every number is rounded the same way wherever it is printed.
 */
import { formatNumber, texNumber, texNumberP } from '@/lib/units/format'

/** A number for TeX. */
export const tex = (x: number): string => texNumber(x)

/** Bracketed when negative, for use inside an expression. */
export const texp = (x: number): string => texNumberP(x)

/** Plain-text number for messages and notes (true minus sign). */
export const plain = (x: number): string => formatNumber(x)
