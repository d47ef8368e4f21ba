import { afterAll, beforeAll, expect, it } from 'vitest'
import { createTestApp } from '../helpers/app'
import { onPostgres } from '../helpers/test-database'
import { stockEvents } from '../../server/db'
import { runSoak } from '../../scripts/ledger-soak'

/**
 * The 10,000 operations on SQLite (about half a minute here); the PostgreSQL pass runs
 * 2,000 to keep CI short (`npx tsx … scripts/ledger-soak.ts 10000` runs any count by hand).
 */
const OPERATIONS = onPostgres ? 2000 : 10_000

let t: Awaited<ReturnType<typeof createTestApp>>
beforeAll(async () => {
  t = await createTestApp({ demo: true })
  // Alerts follow every stock change; the soak tests the ledger alone.
  stockEvents.removeAllListeners('stock-changed')
})
afterAll(() => t?.close())

it('keeps the ledger reconciled and stock never negative under six members working at once', async () => {
  const r = await runSoak(t.dataSource, OPERATIONS, 6)
  console.info(`ledger soak: ${JSON.stringify(r)}`)
  expect(r.applied + r.refused).toBe(OPERATIONS)
  expect(r.differences).toBe(0)
  expect(r.negativeLots).toBe(0)
  for (const kind of ['receive', 'take', 'reserve', 'release', 'move', 'count', 'order-receipt']) expect(r.byKind[kind]).toBeGreaterThan(50)
  expect(r.applied).toBeGreaterThan(OPERATIONS / 3)
  const negative = await t.dataSource.query('SELECT COUNT(*) AS n FROM stock_lots WHERE quantity < 0') as { n: number }[]
  expect(Number(negative[0].n)).toBe(0)
}, 300_000)
