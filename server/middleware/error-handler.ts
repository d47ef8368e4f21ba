import type { ErrorRequestHandler, RequestHandler } from 'express'
import { AppError, toAppError, toErrorBody } from '../errors'

/** Unknown /api paths answer in the error shape rather than with the client's HTML. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'NOT_FOUND', `There is no API route ${req.method} ${req.path}.`))
}

/** The one place errors become responses: { error: { code, message, details? } }. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const e = toAppError(err)
  if (e.status >= 500) req.log?.error({ err }, 'request failed')
  if (res.headersSent) return
  res.status(e.status).json(toErrorBody(e))
}
