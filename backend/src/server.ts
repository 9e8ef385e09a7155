import { createApp } from './app'
import { createDb } from './db/client'
import { loadEnv } from './env'
import { createLogger } from './logger'
import { startJobQueue } from './jobs/queue'
import { imageTilingJob, importCommitJob, packBuildJob } from './jobs/handlers'
import { createMailer } from './mail/transport'
import { startSweeper } from './services/leases'

const env = loadEnv()
const logger = createLogger(env.LOG_LEVEL)
// A dropped connection is logged, never fatal: the pool reconnects when the database is back.
const { db, pool } = createDb(env.DATABASE_URL, 10, (err) =>
  logger.warn({ err: err.message }, 'database connection lost'),
)
const mail = createMailer(env, logger)
const jobs = await startJobQueue(
  env.DATABASE_URL,
  {
    'import-commit': importCommitJob(db, pool, mail, logger),
    'pack-build': packBuildJob(db, logger),
    'image-tiling': imageTilingJob(db, logger),
  },
  logger,
)
const app = createApp({ db, pool, env, logger, jobs, mail })
// Work that lost its server (a crash, a kill) shows as failed — interrupted within a minute.
const stopSweeper = startSweeper(db, (err) => logger.warn({ err }, 'interrupted-work sweep failed'))

const server = app.listen(env.PORT, env.HOST, () => {
  const url = `http://${env.HOST}:${env.PORT}`
  logger.info({ url }, 'Downdip is serving')
  console.log(`\n  Downdip: ${url}\n`)
  console.log('  Demo accounts (password downdip-demo):')
  for (const who of ['admin', 'lead', 'engineer', 'logger', 'viewer']) {
    console.log(`    ${who.padEnd(9)} ${who}@greyscar.test`)
  }
  console.log('')
})

let stopping = false
function shutdown(signal: string) {
  if (stopping) return
  stopping = true
  logger.info({ signal }, 'stopping')
  stopSweeper()
  server.close(() => {
    jobs
      .stop()
      .then(() => pool.end())
      .finally(() => process.exit(0))
  })
  server.closeAllConnections()
  setTimeout(() => process.exit(1), 10_000).unref()
}
process.on('SIGINT', () => shutdown('SIGINT'))
process.on('SIGTERM', () => shutdown('SIGTERM'))
