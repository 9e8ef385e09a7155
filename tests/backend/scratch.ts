import { execFileSync } from 'node:child_process'
import { createServer, type AddressInfo } from 'node:net'

/**
 * Tests that stop, kill or restore a database use a scratch cluster of their own (never the shared
 * test database): `scratch('up', dir, port[, 'durable'])`, `'stop'`, `'start'`, `'down'` run
 * backend/scripts/pg-scratch.sh.
 */
export const scratch = (...args: string[]) =>
  execFileSync('bash', ['backend/scripts/pg-scratch.sh', ...args], { stdio: 'pipe' })

/** A loopback port free right now (for a scratch cluster or a server process). */
export async function freePort(): Promise<number> {
  const s = createServer()
  await new Promise<void>((resolve) => s.listen(0, '127.0.0.1', resolve))
  const { port } = s.address() as AddressInfo
  await new Promise<void>((resolve) => s.close(() => resolve()))
  return port
}
