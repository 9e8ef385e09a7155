// Runs the fake SMTP server on its own: `tsx backend/src/mail/fake-smtp-cli.ts`
// (port FAKE_SMTP_PORT, default 2525; messages stored in DATABASE_URL's captured_mails).
import { createDb } from '../db/client'
import { loadEnv } from '../env'
import { createLogger } from '../logger'
import { startFakeSmtp } from './fake-smtp'

const env = loadEnv()
const logger = createLogger(env.LOG_LEVEL)
const { db, pool } = createDb(env.DATABASE_URL, 2)
const fake = await startFakeSmtp({
  port: env.FAKE_SMTP_PORT,
  db,
  onError: (err) => logger.error({ err }, 'fake SMTP: could not store a message'),
})
logger.info(`fake SMTP server on 127.0.0.1:${fake.port}`)

async function shutdown() {
  await fake.stop()
  await pool.end()
  process.exit(0)
}
process.once('SIGINT', () => void shutdown())
process.once('SIGTERM', () => void shutdown())
