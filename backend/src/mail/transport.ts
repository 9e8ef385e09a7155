import nodemailer, { type Transporter } from 'nodemailer'
import type { Env } from '../env'
import type { Logger } from '../logger'

export type MailSettings = Pick<Env, 'SMTP_URL' | 'MAIL_FROM' | 'APP_URL'>

export interface OutgoingMail {
  to: string
  subject: string
  text: string
  html: string
}

/**
 * The app's way out for mail, built once (server.ts, the test fixtures) and handed to createApp,
 * which passes it to every service that sends mail.
 */
export interface Mailer {
  /** Sends one mail; rejects when the SMTP server refuses it or cannot be reached. */
  send: (mail: OutgoingMail) => Promise<void>
  /** An absolute link into the app; paths are taken relative to APP_URL. */
  link: (pathOrUrl: string) => string
  /** Where mail failures are reported (they never fail the request that caused the mail). */
  logger: Logger
}

export function createMailer(settings: MailSettings, logger: Logger): Mailer {
  let transport: Transporter | undefined
  // Short timeouts: a request that sends mail must not hang for minutes when mail is down.
  const transportOf = () =>
    (transport ??= nodemailer.createTransport({
      url: settings.SMTP_URL,
      connectionTimeout: 5_000,
      greetingTimeout: 5_000,
      socketTimeout: 10_000,
    }))
  return {
    send: async (mail) => {
      await transportOf().sendMail({ from: settings.MAIL_FROM, ...mail })
    },
    link: (pathOrUrl) => {
      if (/^https?:\/\//.test(pathOrUrl)) return pathOrUrl
      const base = settings.APP_URL.replace(/\/+$/, '')
      return base + (pathOrUrl.startsWith('/') ? '' : '/') + pathOrUrl
    },
    logger,
  }
}
