import { Router, type RequestHandler } from 'express'
import passport from 'passport'
import { rateLimit, ipKeyGenerator } from 'express-rate-limit'
import { AppError, toErrorBody } from '../errors'
import { requireSignIn, currentUser } from '../middleware/auth'
import { changeOwnPassword, toUserDto } from '../services/users'
import { changePasswordInput, loginInput } from '../../shared/schemas/user'
import type { Config } from '../config'
import type { User } from '../entities'
import type { CsrfTokenGenerator } from 'csrf-sync'

/** Sign-in, sign-out, the current session and one's own password. */
export function authRouter(config: Config, generateToken: CsrfTokenGenerator) {
  const auth = Router()

  const loginLimiter = rateLimit({
    windowMs: config.LOGIN_WINDOW_MIN * 60_000,
    limit: config.LOGIN_MAX_TRIES,
    skipSuccessfulRequests: true,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.username ?? '').toLowerCase()}`,
    handler: (_req, res) => {
      res.status(429).json(toErrorBody(new AppError(429, 'TOO_MANY_TRIES',
        `Too many sign-in attempts. Wait ${config.LOGIN_WINDOW_MIN} minutes and try again.`)))
    },
  })

  auth.get('/session', (req, res) => {
    res.json({ user: req.user ? toUserDto(req.user as User) : null, csrfToken: generateToken(req) })
  })

  const authenticate: RequestHandler = (req, res, next) => {
    loginInput.parse(req.body)
    passport.authenticate('local', (err: unknown, user: User | false) => {
      if (err) return next(err)
      if (!user) return next(new AppError(401, 'BAD_CREDENTIALS', 'Username or password is not right.'))
      // passport ≥ 0.6 regenerates the session here, so a session id never survives sign-in.
      req.login(user, (loginErr) => {
        if (loginErr) return next(loginErr)
        res.json({ user: toUserDto(user), csrfToken: generateToken(req, true) })
      })
    })(req, res, next)
  }
  auth.post('/login', loginLimiter, authenticate)

  auth.post('/logout', (req, res, next) => {
    req.logout((err) => {
      if (err) return next(err)
      req.session.destroy((destroyErr) => {
        if (destroyErr) return next(destroyErr)
        res.clearCookie('binwright.sid').status(204).end()
      })
    })
  })

  auth.post('/password', requireSignIn, async (req, res) => {
    await changeOwnPassword(currentUser(req).id, changePasswordInput.parse(req.body))
    res.status(204).end()
  })

  return auth
}
