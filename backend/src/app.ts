import express from 'express'
import session from 'express-session'
import connectPgSimple from 'connect-pg-simple'
import helmet from 'helmet'
import { pinoHttp } from 'pino-http'
import type pg from 'pg'
import { existsSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import type { Db } from './db/client'
import type { Env } from './env'
import type { Logger } from './logger'
import type { JobQueue } from './jobs/queue'
import type { Mailer } from './mail/transport'
import { createPassport } from './auth/passport'
import { requireCsrfToken } from './auth/csrf'
import { loadProject, requireSignedIn } from './auth/guards'
import { sessionLifetime } from './auth/session-lifetime'
import { errorHandler, notFoundHandler } from './http/error-handler'
import { agsRouter } from './routes/ags'
import { authRouter, passwordResetRouter } from './routes/auth'
import { healthRouter } from './routes/health'
import { invitationsRouter } from './routes/invitations'
import { mailboxRouter } from './routes/mailbox'
import { projectRouter, projectsRouter } from './routes/projects'
import { usersRouter } from './routes/users'

export interface AppDeps {
  db: Db
  pool: pg.Pool
  env: Env
  logger: Logger
  /** The background queue; without it (single-process tests) large imports commit in the request. */
  jobs?: JobQueue
  /** Every mail the app sends goes out through this (createMailer in mail/transport.ts). */
  mail: Mailer
}

const distDir = fileURLToPath(new URL('../../frontend/dist', import.meta.url))

/** Builds the Express app (no listen): security → body → session/auth → routers → errors. */
export function createApp({ db, pool, env, logger, jobs, mail }: AppDeps) {
  const app = express()
  const passport = createPassport(db)
  const PgStore = connectPgSimple(session)
  const store = new PgStore({
    pool,
    tableName: 'sessions',
    createTableIfMissing: false,
    pruneSessionInterval: env.NODE_ENV === 'test' ? false : 15 * 60,
  })
  // Only the configured proxies' X-Forwarded-For is believed; anyone else's is ignored.
  app.set('trust proxy', env.TRUST_PROXY ? env.TRUST_PROXY : false)
  app.disable('x-powered-by')

  // security
  app.use(
    helmet({ contentSecurityPolicy: { directives: { 'img-src': ["'self'", 'data:', 'blob:'] } } }),
  )
  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      serializers: {
        req: (req: { method: string; url: string }) => ({ method: req.method, url: req.url }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
    }),
  )
  // body
  app.use('/api', express.json({ limit: '5mb' }))
  // session and auth
  app.use(
    '/api',
    session({
      store,
      name: 'downdip.sid',
      secret: env.SESSION_SECRET,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: env.TRUST_PROXY ? 'auto' : false,
        // rolling: every answer moves the expiry on, so this is the idle timeout (cookie and store)
        maxAge: env.SESSION_IDLE_MINUTES * 60 * 1000,
      },
    }),
  )
  app.use('/api', passport.session())
  app.use('/api', sessionLifetime(env.SESSION_MAX_HOURS))
  app.use('/api', (_req, res, next) => {
    // API answers carry project data: never kept by the browser or a proxy (OWASP ASVS 4.0 V8.2.1)
    res.set('Cache-Control', 'no-store')
    next()
  })
  app.use('/api', requireCsrfToken)
  // routers
  app.use('/api/health', healthRouter(db))
  app.use('/api/auth', authRouter(db, passport, env.LOGIN_ATTEMPTS_PER_WINDOW))
  app.use('/api/auth', passwordResetRouter(db, mail, env.LOGIN_ATTEMPTS_PER_WINDOW))
  app.use('/api/users', usersRouter(db))
  app.use('/api/invitations', invitationsRouter(db, mail))
  app.use('/api/dev/mailbox', mailboxRouter(db, env))
  app.use('/api/ags', requireSignedIn, agsRouter(db, env.UPLOAD_LIMIT_MB))
  app.use('/api/projects', requireSignedIn, projectsRouter(db))
  app.use(
    '/api/projects/:projectId',
    loadProject(db),
    projectRouter({
      db,
      pool,
      jobs,
      mail,
      logger,
      uploadLimitMb: env.UPLOAD_LIMIT_MB,
      imageUploadLimitMb: env.IMAGE_UPLOAD_LIMIT_MB,
    }),
  )
  app.use('/api', notFoundHandler)
  // the built app, with history-mode fallback
  if (existsSync(distDir)) {
    app.use(express.static(distDir, { index: false, maxAge: '1h' }))
    app.get(/^(?!\/api\/).*/, (_req, res) => res.sendFile('index.html', { root: distDir }))
  }
  app.use(errorHandler(logger))
  return app
}
