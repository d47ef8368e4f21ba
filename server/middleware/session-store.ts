import session from 'express-session'
import { LessThan } from 'typeorm'
import { db } from '../db'
import { SessionRecord } from '../entities'

/** Fallback lifetime when a cookie has no expiry: one day. */
const DEFAULT_TTL_MS = 24 * 60 * 60 * 1000

type Callback = (err?: unknown, value?: session.SessionData | null) => void

/** express-session store over our own database, so sessions survive restarts. */
export class DatabaseSessionStore extends session.Store {
  private repo = () => db().getRepository(SessionRecord)

  private expiry(sess: session.SessionData): number {
    const expires = sess.cookie?.expires
    return expires ? new Date(expires).getTime() : Date.now() + DEFAULT_TTL_MS
  }

  get(sid: string, cb: Callback) {
    this.repo()
      .findOneBy({ sid })
      .then((row) => {
        if (!row || Number(row.expiresAt) < Date.now()) return cb(null, null)
        cb(null, JSON.parse(row.data) as session.SessionData)
      }, cb)
  }

  set(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void) {
    this.repo()
      .save({ sid, data: JSON.stringify(sess), expiresAt: this.expiry(sess) })
      .then(() => cb?.(), (err) => cb?.(err))
  }

  destroy(sid: string, cb?: (err?: unknown) => void) {
    this.repo()
      .delete({ sid })
      .then(() => cb?.(), (err) => cb?.(err))
  }

  touch(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void) {
    this.repo()
      .update({ sid }, { expiresAt: this.expiry(sess) })
      .then(() => cb?.(), (err) => cb?.(err))
  }

  /** Deletes expired sessions; called now and then by the server. */
  async sweep(): Promise<number> {
    const result = await this.repo().delete({ expiresAt: LessThan(Date.now()) })
    return result.affected ?? 0
  }
}
