import pino from 'pino'

/** Structured logs; credentials, cookies and CSRF tokens never reach the output. */
export function createLogger(level: string) {
  return pino({
    level,
    redact: {
      paths: [
        'req.headers.cookie',
        'req.headers["x-csrf-token"]',
        'req.headers.authorization',
        'res.headers["set-cookie"]',
        'password',
        '*.password',
      ],
      censor: '[redacted]',
    },
  })
}

export type Logger = ReturnType<typeof createLogger>
