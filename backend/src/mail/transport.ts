import nodemailer, { type Transporter } from 'nodemailer'
import { loadEnv, type Env } from '../env'
import { createLogger, type Logger } from '../logger'

export type MailSettings = Pick<Env, 'SMTP_URL' | 'MAIL_FROM' | 'APP_URL'>

export interface OutgoingMail {
  to: string
  subject: string
  text: string
  html: string
}

let configured: MailSettings | null = null
let logger: Logger | null = null
const transports = new Map<string, Transporter>()

/**
 * Records the app's mail settings. The mail routers call it while createApp builds them, so
 * notifyProject (which only receives the db) sends through the same server as the routes.
 */
export function configureMail(env: MailSettings & Pick<Env, 'LOG_LEVEL'>): void {
  configured = { SMTP_URL: env.SMTP_URL, MAIL_FROM: env.MAIL_FROM, APP_URL: env.APP_URL }
  logger = createLogger(env.LOG_LEVEL)
}

/** Where mail failures are reported (they never fail the request that caused the mail). */
export function mailLogger(): Logger {
  logger ??= createLogger(loadEnv().LOG_LEVEL)
  return logger
}

export function mailSettings(): MailSettings {
  return configured ?? loadEnv()
}

function transportFor(url: string): Transporter {
  let transport = transports.get(url)
  if (!transport) {
    // Short timeouts: a request that sends mail must not hang for minutes when mail is down.
    transport = nodemailer.createTransport({
      url,
      connectionTimeout: 5_000,
      greetingTimeout: 5_000,
      socketTimeout: 10_000,
    })
    transports.set(url, transport)
  }
  return transport
}

/** Sends one mail; rejects when the SMTP server refuses it or cannot be reached. */
export async function sendMail(mail: OutgoingMail, settings = mailSettings()): Promise<void> {
  await transportFor(settings.SMTP_URL).sendMail({ from: settings.MAIL_FROM, ...mail })
}

/** An absolute link into the app; paths are taken relative to APP_URL. */
export function appLink(pathOrUrl: string, settings = mailSettings()): string {
  if (/^https?:\/\//.test(pathOrUrl)) return pathOrUrl
  return settings.APP_URL.replace(/\/+$/, '') + (pathOrUrl.startsWith('/') ? '' : '/') + pathOrUrl
}
