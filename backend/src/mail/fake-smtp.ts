import type { AddressInfo } from 'node:net'
import { SMTPServer } from 'smtp-server'
import { capturedMails } from '../../../schema/index'
import type { Db } from '../db/client'
import { parseMail } from './parse'

export interface FakeSmtp {
  port: number
  stop: () => Promise<void>
}

export interface FakeSmtpOptions {
  port: number
  db: Db
  /** Called when a message cannot be stored; the sender then gets a 451 and may retry. */
  onError?: (err: unknown) => void
}

/**
 * The local fake SMTP server: loopback only, no auth, no TLS. Every message it accepts is stored
 * in captured_mails (read by the dev mailbox) before the sender hears 250, so a test that awaits
 * a send finds the row.
 */
export function startFakeSmtp({ port, db, onError }: FakeSmtpOptions): Promise<FakeSmtp> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    hideSTARTTLS: true,
    size: 2 * 1024 * 1024,
    logger: false,
    banner: 'Downdip fake mail server',
    onData(stream, session, callback) {
      const chunks: Buffer[] = []
      stream.on('data', (chunk: Buffer) => chunks.push(chunk))
      stream.on('end', () => {
        const parsed = parseMail(Buffer.concat(chunks).toString('utf8'))
        const envelopeTo = session.envelope.rcptTo.map((r) => r.address).join(', ')
        const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : ''
        db.insert(capturedMails)
          .values({
            from: parsed.from || envelopeFrom,
            to: envelopeTo || parsed.to,
            subject: parsed.subject,
            text: parsed.text,
            html: parsed.html,
          })
          .then(
            () => callback(),
            (err: unknown) => {
              onError?.(err)
              callback(
                Object.assign(new Error('Could not store the message'), { responseCode: 451 }),
              )
            },
          )
      })
    },
  })
  return new Promise((resolve, reject) => {
    server.once('error', reject)
    server.listen(port, '127.0.0.1', () => {
      server.off('error', reject)
      const actual = (server.server.address() as AddressInfo).port
      resolve({ port: actual, stop: () => new Promise<void>((done) => server.close(() => done())) })
    })
  })
}
