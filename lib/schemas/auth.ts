import { z } from 'zod'

export const MIN_PASSWORD_LENGTH = 10

export const emailField = z.string().trim().min(1, 'Enter your e-mail address.').email('Enter a valid e-mail address.')

export const signInSchema = z.object({
  email: emailField,
  password: z.string().min(1, 'Enter your password.'),
})

const newPassword = z
  .string()
  .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters.`)
  .max(200, 'Use at most 200 characters.')

const passwordsMatch = (v: { password: string; confirm: string }) => v.password === v.confirm
const mismatch = { path: ['confirm'], message: 'The two passwords differ.' }

export const acceptInvitationSchema = z
  .object({
    token: z.string().min(1),
    name: z.string().trim().min(2, 'Enter your name as it should appear on signed calcs.').max(120),
    password: newPassword,
    confirm: z.string(),
  })
  .refine(passwordsMatch, mismatch)

export const resetRequestSchema = z.object({ email: emailField })
export const resetPasswordSchema = z
  .object({ token: z.string().min(1), password: newPassword, confirm: z.string() })
  .refine(passwordsMatch, mismatch)
