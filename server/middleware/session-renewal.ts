import type { RequestHandler } from 'express'

declare module 'express-session' {
  interface SessionData {
    /** When this signed-in session's cookie was last sent again with a fresh lifetime (ms since 1970). */
    renewedAt?: number
  }
}

/** A signed-in member's cookie is sent again with its full lifetime at most this often: ten minutes. */
export const COOKIE_RENEW_MS = 10 * 60 * 1000

/**
 * Keeps a signed-in member's session alive while they work, without re-signing and sending the
 * cookie on every answer (express-session's `rolling`): once every COOKIE_RENEW_MS the session
 * is marked changed, so express-session saves it and sends the cookie with a fresh lifetime.
 * A session therefore ends between (lifetime − 10 minutes) and its lifetime after the last request.
 * Runs after passport.session(); sessions of visitors not signed in are left alone.
 */
export const renewSignedInSession: RequestHandler = (req, _res, next) => {
  const now = Date.now()
  if (req.user && req.session && now - (req.session.renewedAt ?? 0) >= COOKIE_RENEW_MS) req.session.renewedAt = now
  next()
}
