/**
 * 10,000 mixed ledger operations (receive, take, reserve, release, move, count, order receipt)
 * from six members at once through the services, on the demo workshop (scripts/ledger-soak.ts),
 * then check:ledger at that size, timed on its own.
 */
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { record } from '../harness'
import { runSoak } from '../../scripts/ledger-soak'
import { openDatabase } from '../../server/database'
import { seedDemo } from '../../seeds/demo'
import { stockEvents } from '../../server/db'
import { checkLedger } from '../../server/services/ledger-check'
import { Movement } from '../../server/entities'

const OPERATIONS = 10_000
const MEMBERS = 6
/** The goal for check:ledger at this size. */
const CHECK_GOAL_MS = 2000

export const ledgerSuite = {
  name: `ledger: ${OPERATIONS.toLocaleString('en-GB')} mixed operations, then check:ledger`,
  async run() {
    const dir = mkdtempSync(join(tmpdir(), 'binwright-bench-ledger-'))
    const ds = await openDatabase(join(dir, 'ledger.sqlite'))
    try {
      await seedDemo(ds)
      // Alerts are not part of this figure (the reservations suite runs with them).
      const followers = stockEvents.listeners('stock-changed')
      stockEvents.removeAllListeners('stock-changed')
      const r = await runSoak(ds, OPERATIONS, MEMBERS)
      for (const f of followers) stockEvents.on('stock-changed', f as (ids: number[]) => void)
      const t0 = performance.now()
      const check = await checkLedger(ds)
      const checkMs = performance.now() - t0
      const opsMs = Math.max(1, r.ms - checkMs)
      record({ figure: `ledger operations (${r.applied} applied, ${r.refused} refused as 4xx)`, value: OPERATIONS / (opsMs / 1000), unit: 'ops/s' })
      record({ figure: 'ledger rows after the soak', value: await ds.getRepository(Movement).count(), unit: 'rows' })
      record({ figure: 'check:ledger at that size', value: checkMs, unit: 'ms', goal: `≤ ${CHECK_GOAL_MS} ms`, pass: checkMs <= CHECK_GOAL_MS })
      record({ figure: 'ledger differences and negative lots', value: check.differences.length + check.negativeLots, unit: 'count', goal: '= 0', pass: !check.differences.length && !check.negativeLots })
    } finally {
      await ds.destroy()
      rmSync(dir, { recursive: true, force: true })
    }
  },
}
