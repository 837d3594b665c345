/** Typed errors thrown deep down and mapped to HTTP status in one place (app/_lib/api.ts). */
export type AppErrorCode =
  | 'bad_request'
  | 'unauthenticated'
  | 'forbidden'
  | 'not_found'
  | 'invalid'
  | 'conflict'
  | 'too_large'
  | 'unsupported_media_type'
  | 'rate_limited'
  | 'frozen'

export const HTTP_STATUS: Record<AppErrorCode, number> = {
  bad_request: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  invalid: 422,
  conflict: 409,
  too_large: 413,
  unsupported_media_type: 415,
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
