/** zod number fields with the calc's messages, shared by every mechanism's geometry and the common inputs. */
import { z } from 'zod'

export const num = () => z.number({ error: (iss) => (iss.input === undefined ? 'is required' : 'must be a number') })
export const positive = () => num().positive({ error: 'must be positive' })
export const nonNegative = () => num().nonnegative({ error: 'must not be negative' })
export const fraction = () => num().gt(0, { error: 'must be between 0 and 1' }).lt(1, { error: 'must be between 0 and 1' })
