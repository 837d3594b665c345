/** Typed errors thrown deep down and mapped to HTTP status in one place (app/_lib/api.ts). */
export type AppErrorCode = 'unauthenticated' | 'forbidden' | 'not_found' | 'invalid' | 'conflict' | 'rate_limited' | 'frozen'

export const HTTP_STATUS: Record<AppErrorCode, number> = {
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  invalid: 422,
  conflict: 409,
  rate_limited: 429,
  frozen: 409,
}

export class AppError extends Error {
  constructor(
    readonly code: AppErrorCode,
    message: string,
    /** Field path → message, for errors that belong next to a form field. */
    readonly fieldErrors?: Record<string, string>,
  ) {
    super(message)
    this.name = 'AppError'
  }
}
