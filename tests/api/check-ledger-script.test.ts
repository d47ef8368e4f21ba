import { spawnSync } from 'node:child_process'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestApp } from '../helpers/app'
import { onPostgres } from '../helpers/test-database'
import { isPostgresUrl } from '../../server/data-source'

/** Runs `npm run check:ledger` as a user would, against the given SQLite file or PostgreSQL address. */
const runCheck = (location: string) => spawnSync(process.execPath,
  ['--import', 'tsx/esm', 'scripts/check-ledger.ts'],
  {
    env: { ...process.env, TSX_TSCONFIG_PATH: 'tsconfig.server.json', ...(isPostgresUrl(location) ? { DATABASE_URL: location } : { DATABASE_PATH: location }) },
    encoding: 'utf8', timeout: 60_000,
  })

let t: Awaited<ReturnType<typeof createTestApp>>
let path: string
beforeAll(async () => {
  t = await createTestApp({ demo: true })
  path = t.config.database
})
afterAll(() => t.close())

describe('npm run check:ledger', () => {
  it('exits 0 and says the ledger reconciles on the demo database', () => {
    const run = runCheck(path)
    expect(run.stdout).toMatch(/Checked \d+ stock lots against \d+ movements in \d+ ms\./)
    expect(run.stdout).toContain('Ledger reconciles.')
    expect(run.status).toBe(0)
  })

  it('exits 1 and names the lot when a stock level was changed behind the ledger', async () => {
    const [lot] = await t.dataSource.query('SELECT id, quantity FROM stock_lots ORDER BY id LIMIT 1')
    await t.dataSource.query(`UPDATE stock_lots SET quantity = quantity + 5 WHERE id = ${Number(lot.id)}`)
    const run = runCheck(path)
    expect(run.stdout).toContain(`lot ${lot.id} `)
    expect(run.stdout).toContain(`recorded ${lot.quantity + 5}, ledger says ${lot.quantity}`)
    expect(run.stdout).toContain('Ledger does NOT reconcile.')
    expect(run.status).toBe(1)
  })

  it.skipIf(onPostgres)('exits 2 with a clear message when there is no database file', () => {
    const run = runCheck(join(t.dir, 'missing.sqlite'))
    expect(run.stderr).toContain('No database at')
    expect(run.status).toBe(2)
  })
})
