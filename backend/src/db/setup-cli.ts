/**
 * Start-up helper: `tsx backend/src/db/setup-cli.ts [--seed-demo] [--quiet] [--expect-no-change]`.
 * Applies migrations, optionally seeds the demo; with --expect-no-change exits 1 if seeding
 * changed any row count (the idempotence check run by npm test).
 */
import { sql } from 'drizzle-orm'
import { createDb, type Db } from './client'
import { runMigrations } from './migrate'
import { seedDemo } from './seed-demo'
import { loadEnv } from '../env'

const args = new Set(process.argv.slice(2))
const say = (msg: string) => {
  if (!args.has('--quiet')) console.log(msg)
}

async function rowCounts(db: Db): Promise<Record<string, number>> {
  const result = await db.execute<{ table_name: string; n: number }>(sql`
    select c.relname as table_name,
           (xpath('/row/n/text()', query_to_xml(format('select count(*) as n from public.%I', c.relname), false, true, '')))[1]::text::int as n
    from pg_class c join pg_namespace s on s.oid = c.relnamespace
    where s.nspname = 'public' and c.relkind = 'r' and c.relname <> 'sessions'
    order by 1`)
  return Object.fromEntries(result.rows.map((r) => [r.table_name, Number(r.n)]))
}

const env = loadEnv()
const { db, pool } = createDb(env.DATABASE_URL, 2)
try {
  await runMigrations(db)
  say('  migrations applied')
  if (args.has('--seed-demo')) {
    const before = await rowCounts(db)
    await seedDemo(db)
    const after = await rowCounts(db)
    const changed = Object.keys(after).filter((t) => after[t] !== before[t])
    say(
      changed.length
        ? `  demo seeded (${changed.map((t) => `${t} ${after[t]}`).join(', ')})`
        : '  demo already present',
    )
    if (args.has('--expect-no-change') && changed.length) {
      console.error(`seeding twice changed: ${changed.join(', ')}`)
      process.exitCode = 1
    }
  }
} finally {
  await pool.end()
}
