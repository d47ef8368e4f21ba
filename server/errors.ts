import { ZodError } from 'zod'
import { EntityNotFoundError } from 'typeorm'
import type { ApiErrorBody } from '../shared/types/api'

/** An error a service throws on purpose; the error middleware turns it into the one error shape. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message)
  }
}

export const notFound = (what: string) => new AppError(404, 'NOT_FOUND', `${what} was not found.`)
export const forbidden = (message = 'Your role does not allow this.') =>
  new AppError(403, 'FORBIDDEN', message)
export const conflict = (code: string, message: string, details?: unknown) =>
  new AppError(409, code, message, details)
export const badRequest = (code: string, message: string, details?: unknown) =>
  new AppError(400, code, message, details)

/** Readable one-line summary of zod issues: "quantity: must be at least 1; partId: required". */
export function describeZodError(err: ZodError): string {
  return err.issues
    .map((i) => (i.path.length ? `${i.path.join('.')}: ${i.message}` : i.message))
    .join('; ')
}

interface HttpishError {
  status?: number
  statusCode?: number
  type?: string
  code?: string
  message?: string
}

/** Maps anything thrown in a request to an AppError (unknown errors become 500). */
export function toAppError(err: unknown): AppError {
  if (err instanceof AppError) return err
  if (err instanceof ZodError) {
    const details = err.issues.map((i) => ({ path: i.path.join('.'), message: i.message }))
    return new AppError(400, 'INVALID_INPUT', describeZodError(err), details)
  }
  if (err instanceof EntityNotFoundError) return notFound('The record')
  const e = (err ?? {}) as HttpishError
  if (e.type === 'entity.parse.failed') {
    return new AppError(400, 'MALFORMED_JSON', 'The request body is not valid JSON.')
  }
  if (e.type === 'entity.too.large') {
    return new AppError(413, 'TOO_LARGE', 'The request body is too large.')
  }
  if (e.code === 'LIMIT_FILE_SIZE') {
    return new AppError(413, 'FILE_TOO_LARGE', 'The file is larger than the upload limit.')
  }
  if (typeof e.code === 'string' && e.code.startsWith('LIMIT_')) {
    return new AppError(400, 'BAD_UPLOAD', e.message ?? 'The upload was refused.')
  }
  const status = e.status ?? e.statusCode
  if (status && status >= 400 && status < 500) {
    return new AppError(status, 'BAD_REQUEST', e.message ?? 'The request was refused.')
  }
  return new AppError(500, 'INTERNAL', 'Something went wrong on the server; it has been logged.')
}

export const toErrorBody = (e: AppError): ApiErrorBody => ({
  error: { code: e.code, message: e.message, ...(e.details === undefined ? {} : { details: e.details }) },
})
