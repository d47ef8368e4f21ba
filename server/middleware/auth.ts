import passport from 'passport'
import { Strategy as LocalStrategy } from 'passport-local'
import type { RequestHandler } from 'express'
import { AppError, forbidden } from '../errors'
import { findActiveUser, verifyCredentials } from '../services/users'
import type { User } from '../entities'
import { roleAtLeast, type Role } from '../../shared/types/api'

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    /** What passport puts on req.user: our User entity. */
    interface User {
      id: number
      username: string
      displayName: string
      role: Role
    }
  }
}

/** Sets up passport: username + password checked against bcrypt hashes; the session keeps the id. */
export function configurePassport() {
  passport.use(new LocalStrategy((username, password, done) => {
    verifyCredentials(username, password).then((user) => done(null, user ?? false), done)
  }))
  passport.serializeUser((user, done) => done(null, (user as User).id))
  passport.deserializeUser((id: number, done) => {
    findActiveUser(id).then((user) => done(null, user ?? false), done)
  })
  return passport
}

export const requireSignIn: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(new AppError(401, 'SIGN_IN_REQUIRED', 'Please sign in first.'))
  next()
}

/** Allows the role given and every role above it (viewer < builder < storekeeper < admin). */
export const requireRole = (role: Role): RequestHandler => (req, _res, next) => {
  if (!req.user) return next(new AppError(401, 'SIGN_IN_REQUIRED', 'Please sign in first.'))
  if (!roleAtLeast(req.user.role, role)) return next(forbidden(`This needs the ${role} role or above.`))
  next()
}

/** The signed-in user; only for handlers behind requireSignIn or requireRole. */
export const currentUser = (req: Express.Request): Express.User => req.user as Express.User
