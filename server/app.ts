import express from 'express'
import session from 'express-session'
import helmet from 'helmet'
import compression from 'compression'
import { pinoHttp } from 'pino-http'
import { csrfSync } from 'csrf-sync'
import { existsSync } from 'node:fs'
import { randomBytes } from 'node:crypto'
import { join, resolve } from 'node:path'
import type { Config } from './config'
import { DatabaseSessionStore } from './middleware/session-store'
import { configurePassport } from './middleware/auth'
import { apiNotFound, errorHandler } from './middleware/error-handler'
import { authRouter } from './routes/auth'
import { usersRouter } from './routes/users'
import { adminRouter } from './routes/admin'
import { calcRouter } from './routes/calc'
import { mountFeatureRouters } from './routes'
import { startNotifications } from './services/notifications'
import { AppError } from './errors'
import { refuseHiddenText } from './middleware/text-guard'
import { renewSignedInSession } from './middleware/session-renewal'

/** Session lifetime after the last request: 12 hours, a long workshop day (see session-renewal.ts). */
const SESSION_MAX_AGE_MS = 12 * 60 * 60 * 1000
/** zlib's fastest level, for JSON answers (see where it is used). */
const API_GZIP_LEVEL = 1
/** Hashed build assets never change under the same name, so browsers may keep them a year. */
const ASSET_MAX_AGE = '365d'

/** Builds the Express app without listening (tests call this with a temporary database). */
export function createApp(config: Config) {
  const app = express()
  app.disable('x-powered-by')
  if (config.HTTPS) app.set('trust proxy', 1)

  app.use(helmet({
    contentSecurityPolicy: {
      directives: {
        // Plain HTTP on a workshop LAN must not be upgraded to HTTPS that is not there.
        upgradeInsecureRequests: null,
        imgSrc: ["'self'", 'data:', 'blob:'],
        mediaSrc: ["'self'", 'blob:'],
      },
    },
  }))
  // API answers are made afresh per request: gzip level 1 keeps nearly all of level 6's saving
  // on JSON (8 KB of search results: 497 bytes instead of 478) for about a sixth of the CPU.
  // Built files keep the default level: browsers cache them for a year.
  const gzipApi = compression({ level: API_GZIP_LEVEL })
  const gzipFiles = compression()
  app.use((req, res, next) => (req.path.startsWith('/api/') ? gzipApi : gzipFiles)(req, res, next))
  // With logging off (LOG_LEVEL=silent) no request logger is made at all: pino-http builds a
  // child logger and serialises the request for every call even when it writes nothing.
  if (config.LOG_LEVEL !== 'silent') {
    app.use(pinoHttp({
      level: config.LOG_LEVEL,
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
      // A session cookie or form token in a log file would let its reader act as that member.
      redact: { paths: ['req.headers.cookie', 'req.headers["x-csrf-token"]', 'res.headers["set-cookie"]'], censor: '[kept out of the log]' },
    }))
  }
  app.use(express.json({ limit: '1mb' }))
  app.use('/api', refuseHiddenText)

  app.use(sessionMiddleware(config))
  const passport = configurePassport()
  app.use(passport.session())
  app.use(renewSignedInSession)

  const { csrfSynchronisedProtection, generateToken } = csrfSync({
    getTokenFromRequest: (req) => req.get('x-csrf-token'),
    size: 32,
    errorConfig: { statusCode: 403, code: 'CSRF', message: 'Missing or stale form token: reload the page and try again.' },
  })
  app.use('/api', (req, res, next) => {
    csrfSynchronisedProtection(req, res, (err?: unknown) => {
      if (err) return next(new AppError(403, 'CSRF_TOKEN', 'Missing or stale form token: reload the page and try again.'))
      next()
    })
  })

  app.get('/api/health', (_req, res) => {
    res.json({ ok: true })
  })
  app.use('/api/auth', authRouter(config, generateToken))
  app.use('/api/users', usersRouter)
  app.use('/api/admin', adminRouter(config))
  app.use('/api/calc', calcRouter)
  mountFeatureRouters(app, config)
  // Alerts follow every stock change and mail uses this config (timers start in server/index.ts).
  startNotifications(config)
  app.use('/api', apiNotFound)

  serveClient(app, config.CLIENT_DIR)
  app.use(errorHandler)
  return app
}

/** express-session over our own database: the signed cookie every request of a member carries. */
export function sessionMiddleware(config: Config) {
  return session({
    name: 'binwright.sid',
    secret: config.SESSION_SECRET ?? randomBytes(32).toString('hex'),
    store: new DatabaseSessionStore(),
    resave: false,
    saveUninitialized: false,
    // Not rolling: renewSignedInSession sends the cookie again every ten minutes, not every answer.
    rolling: false,
    cookie: { httpOnly: true, sameSite: 'lax', secure: config.HTTPS, maxAge: SESSION_MAX_AGE_MS },
  })
}

/** Serves the built client (CLIENT_DIR) with an SPA fallback, when it has been built. */
function serveClient(app: express.Express, clientDir: string) {
  const dist = resolve(clientDir)
  if (!existsSync(join(dist, 'index.html'))) return
  app.use('/assets', express.static(join(dist, 'assets'), { immutable: true, maxAge: ASSET_MAX_AGE }))
  app.use(express.static(dist, { index: false }))
  app.get('/{*splat}', (_req, res) => {
    // root + relative name: send refuses dot-folders only below the root, so a CLIENT_DIR under .tmp/ works.
    res.set('Cache-Control', 'no-cache').sendFile('index.html', { root: dist })
  })
}
