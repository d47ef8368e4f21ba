import type { RequestHandler } from 'express'
import { AppError } from '../errors'

/**
 * Characters no name, code, note or search in a stores app needs, that hide or disguise text:
 * C0/C1 controls except tab and line breaks (NUL truncates in C libraries and PDFs), bidi
 * overrides and isolates (U+202A–202E, U+2066–2069, the "Trojan Source" trick that shows
 * "A1-03" for another code), and the invisible zero-width space, word joiner and BOM.
 * Zero-width (non-)joiners stay: emoji and some scripts need them.
 */
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const HIDDEN = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f\u200b\u2060\ufeff\u202a-\u202e\u2066-\u2069]/

/** Deepest nesting looked at; express.json's 1 MB limit bounds the rest. */
const MAX_DEPTH = 32

function hiddenIn(value: unknown, path: string, depth = 0): string | null {
  if (typeof value === 'string') return HIDDEN.test(value) ? path : null
  if (depth > MAX_DEPTH) return path
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = hiddenIn(value[i], `${path}[${i}]`, depth + 1)
      if (found) return found
    }
  } else if (value && typeof value === 'object') {
    for (const [key, v] of Object.entries(value)) {
      const found = HIDDEN.test(key) ? `${path}.${key}` : hiddenIn(v, path ? `${path}.${key}` : key, depth + 1)
      if (found) return found
    }
  }
  return null
}

/** The path as routes will see its parameters; a malformed escape is left to Express's own 400. */
function decodedPath(path: string): string {
  try { return decodeURIComponent(path) } catch { return '' }
}

/**
 * Refuses a path, query or JSON body carrying hidden control or direction characters, before
 * any route sees it (a NUL in a code would also be refused by PostgreSQL with a 500).
 */
export const refuseHiddenText: RequestHandler = (req, _res, next) => {
  const where = hiddenIn(decodedPath(req.path), 'path') ?? hiddenIn(req.query, 'query') ?? hiddenIn(req.body, 'body')
  if (!where) return next()
  next(new AppError(400, 'HIDDEN_CHARACTERS',
    'The text contains invisible control or direction characters; retype it without them.', { path: where }))
}
