import { z } from 'zod'
import { PROJECT_ROLES } from '@/lib/review/roles'
import { REMARK_SEVERITIES } from '@/lib/review/workflow'
import { isMechanismId, mechanismIds, mechanisms, type MechanismId } from '@/lib/mechanisms'
import { emailField } from './auth'
import { stripControl } from './clean-text'

/** A calc's type is the id of a registered mechanism (lib/mechanisms). */
export type CalcType = MechanismId

/** @deprecated Read `mechanismIds()` from `@/lib/mechanisms` (this is the list as loaded). */
export const CALC_TYPES: readonly CalcType[] = mechanismIds()
/** @deprecated Use `mechanismLabel(id)` from `@/lib/mechanisms` (this is the table as loaded). */
export const CALC_TYPE_LABELS: Readonly<Record<CalcType, string>> = Object.fromEntries(mechanisms().map((m) => [m.id, m.label]))

/** The mechanism field of the create-calc form and API: any registered mechanism id. */
export const calcTypeField = z
  .string({ error: 'Choose a mechanism.' })
  .refine(isMechanismId, { error: 'Choose a mechanism.' })
  .meta({ description: 'Id of a registered mechanism', examples: mechanismIds() })


export const createCalcSchema = z.object({
  number: z
    .string()
    .trim()
    .min(1, 'Give the calc a number.')
    .max(40, 'Use at most 40 characters.')
    .regex(/^[A-Za-z0-9][A-Za-z0-9._/-]*$/, 'Use letters, digits and . _ / - only.'),
  title: z.string().trim().min(3, 'Give the calc a title of at least 3 characters.').max(200).transform((v) => stripControl(v)),
  calcType: calcTypeField,
})

const calcNumber = createCalcSchema.shape.number
const calcTitle = createCalcSchema.shape.title

/** Clone: number and title may be left out (the next free number, "Copy of …"). */
export const cloneCalcSchema = z.object({
  calcId: z.string().min(1),
  number: z.preprocess((v) => (v === '' ? undefined : v), calcNumber.optional()),
  title: z.preprocess((v) => (v === '' ? undefined : v), calcTitle.optional()),
})

/** Import: a calc input file (the CLI's JSON) made into a new calc. */
export const importCalcSchema = z.object({
  number: z.preprocess((v) => (v === '' ? undefined : v), calcNumber.optional()),
  title: calcTitle,
  inputs: z.record(z.string(), z.unknown(), { error: 'must be a calc input object (the CLI’s JSON)' }),
})

export const inviteSchema = z.object({
  email: emailField,
  role: z.enum(PROJECT_ROLES, { message: 'Choose a role.' }),
})

export const createProjectSchema = z.object({
  code: z
    .string()
    .trim()
    .min(2, 'Give the project a code of at least 2 characters.')
    .max(20)
    .regex(/^[A-Z0-9-]+$/, 'Use capital letters, digits and - only.'),
  name: z.string().trim().min(3, 'Give the project a name.').max(120).transform((v) => stripControl(v)),
  client: z.string().trim().max(120).default('').transform((v) => stripControl(v)),
})

export const remarkSchema = z.object({
  calcId: z.string().min(1),
  revisionId: z.string().min(1),
  /** Empty for a remark on the whole calc. */
  stepId: z.string().max(200).optional().transform((v) => v || null),
  severity: z.enum(REMARK_SEVERITIES, { message: 'Choose how serious the remark is.' }),
  text: z.string().trim().min(3, 'Write the remark (at least 3 characters).').max(4000).transform((v) => stripControl(v, { multiline: true })),
})

export const remarkReplySchema = z.object({
  calcId: z.string().min(1),
  remarkId: z.string().min(1),
  text: z.string().trim().min(2, 'Write a reply.').max(4000).transform((v) => stripControl(v, { multiline: true })),
})

export const remarkCloseSchema = z.object({ calcId: z.string().min(1), remarkId: z.string().min(1) })

export const memberRoleSchema = z.object({ userId: z.string().min(1), role: z.enum(PROJECT_ROLES, { message: 'Choose a role.' }) })
export const removeMemberSchema = z.object({ userId: z.string().min(1) })
