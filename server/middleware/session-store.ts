import session from 'express-session'
import { LessThan } from 'typeorm'
import { db } from '../db'
import { SessionRecord } from '../entities'

/** Fallback lifetime when a cookie has no expiry: one day. */
const DEFAULT_TTL_MS = 24 * 60 * 60 * 1000
/**
 * A touch moves the stored expiry on only when it has moved by more than this: a signed-in
 * client polling every second writes the session row once a minute, not once a request. At
 * worst a session restored after a restart ends a minute early of its 12-hour life.
 */
export const TOUCH_INTERVAL_MS = 60_000
/** Sessions kept in memory; the oldest read is dropped past this (it is still in the database). */
const CACHE_MAX = 5_000

type Callback = (err?: unknown, value?: session.SessionData | null) => void

interface Cached {
  /** The session as stored (JSON), parsed afresh on each read since express-session mutates it. */
  data: string
  /** Expiry in memory (moves on every touch). */
  expiresAt: number
  /** Expiry last written to the database. */
  storedExpiresAt: number
}

/**
 * express-session store over our own database, so sessions survive restarts. Reads come from a
 * write-through memory cache (the database is read once per session per process); writes go
 * to the database at once, except touches, which are written at most once a TOUCH_INTERVAL_MS.
 * Sign-out (destroy) removes the session from both at once.
 */
export class DatabaseSessionStore extends session.Store {
  private repo = () => db().getRepository(SessionRecord)
  private cache = new Map<string, Cached>()

  private expiry(sess: session.SessionData): number {
    const expires = sess.cookie?.expires
    return expires ? new Date(expires).getTime() : Date.now() + DEFAULT_TTL_MS
  }

  private remember(sid: string, entry: Cached) {
    this.cache.delete(sid)
    this.cache.set(sid, entry)
    if (this.cache.size > CACHE_MAX) this.cache.delete(this.cache.keys().next().value!)
  }

  get(sid: string, cb: Callback) {
    const hit = this.cache.get(sid)
    if (hit) {
      if (hit.expiresAt < Date.now()) {
        this.cache.delete(sid)
        return cb(null, null)
      }
      return cb(null, JSON.parse(hit.data) as session.SessionData)
    }
    this.repo()
      .findOneBy({ sid })
      .then((row) => {
        if (!row || Number(row.expiresAt) < Date.now()) return cb(null, null)
        const expiresAt = Number(row.expiresAt)
        this.remember(sid, { data: row.data, expiresAt, storedExpiresAt: expiresAt })
        cb(null, JSON.parse(row.data) as session.SessionData)
      }, cb)
  }

  set(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void) {
    const data = JSON.stringify(sess)
    const expiresAt = this.expiry(sess)
    this.repo()
      .save({ sid, data, expiresAt })
      .then(() => {
        this.remember(sid, { data, expiresAt, storedExpiresAt: expiresAt })
        cb?.()
      }, (err) => cb?.(err))
  }

  destroy(sid: string, cb?: (err?: unknown) => void) {
    this.cache.delete(sid)
    this.repo()
      .delete({ sid })
      .then(() => cb?.(), (err) => cb?.(err))
  }

  touch(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void) {
    const expiresAt = this.expiry(sess)
    const hit = this.cache.get(sid)
    if (hit) {
      hit.expiresAt = expiresAt
      if (expiresAt - hit.storedExpiresAt < TOUCH_INTERVAL_MS) return cb?.()
      hit.storedExpiresAt = expiresAt
    }
    this.repo()
      .update({ sid }, { expiresAt })
      .then(() => cb?.(), (err) => cb?.(err))
  }

  /**
   * Deletes expired sessions; called now and then by the server. A stored expiry may lag the
   * real one by up to TOUCH_INTERVAL_MS, so rows are kept that long past it.
   */
  async sweep(): Promise<number> {
    const now = Date.now()
    for (const [sid, c] of this.cache) if (c.expiresAt < now) this.cache.delete(sid)
    const result = await this.repo().delete({ expiresAt: LessThan(now - TOUCH_INTERVAL_MS) })
    return result.affected ?? 0
  }
}
