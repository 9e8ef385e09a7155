import { afterAll, describe, expect, it } from 'vitest'
import { spawn, spawnSync } from 'node:child_process'
import { chmodSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { freePort } from './scratch'

const root = mkdtempSync(join(tmpdir(), 'downdip-signals-'))
chmodSync(root, 0o755)
const dataDir = join(root, 'postgres')

function postgresRunning(): boolean {
  const found = spawnSync('pgrep', ['-f', `postgres -D ${dataDir}`], { encoding: 'utf8' })
  return found.stdout.trim().length > 0
}

async function trial(when: 'serving' | 'starting', delayMs: number) {
  const [port, pgPort, smtpPort] = [await freePort(), await freePort(), await freePort()]
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    PORT: String(port),
    PGPORT: String(pgPort),
    FAKE_SMTP_PORT: String(smtpPort),
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    DOWNDIP_DATA_DIR: dataDir,
    LOG_LEVEL: 'warn',
  }
  delete env.DATABASE_URL
  const child = spawn('npm', ['start'], { env, detached: true, stdio: 'ignore' })
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()))
  const started = Date.now()
  if (when === 'serving') {
    while (Date.now() - started < 120_000) {
      const ok = await fetch(`http://127.0.0.1:${port}/api/health`)
        .then((r) => r.ok)
        .catch(() => false)
      if (ok) break
      await new Promise((r) => setTimeout(r, 250))
    }
  } else {
    while (!postgresRunning() && Date.now() - started < 60_000)
      await new Promise((r) => setTimeout(r, 100))
  }
  await new Promise((r) => setTimeout(r, delayMs))
  process.kill(-child.pid!, 'SIGINT')
  await Promise.race([exited, new Promise((r) => setTimeout(r, 60_000))])
  // the script has exited; give the postmaster's own exit a moment
  for (let i = 0; i < 20 && postgresRunning(); i++) await new Promise((r) => setTimeout(r, 250))
  return postgresRunning()
}

afterAll(() => {
  spawnSync('bash', ['backend/scripts/pg-scratch.sh', 'down', dataDir])
  rmSync(root, { recursive: true, force: true })
}, 60_000)

describe('npm start and Ctrl-C', () => {
  it('SIGINT to the process group stops PostgreSQL: while serving (at once, after 1 s) and while starting up', async () => {
    const left: string[] = []
    for (const [when, delay] of [
      ['serving', 0],
      ['serving', 1000],
      ['starting', 500],
      ['serving', 200],
    ] as const) {
      if (await trial(when, delay)) left.push(`${when}+${delay}ms`)
    }
    expect(left).toEqual([])
  }, 300_000)
})
