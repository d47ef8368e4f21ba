/** `npm run check:ledger`: proves every stock level equals the sum of its ledger movements. */
import { existsSync } from 'node:fs'
import { loadConfig } from '../server/config'
import { createDataSource, describeDatabase, isPostgresUrl } from '../server/data-source'
import { checkLedger } from '../server/services/ledger-check'

const config = loadConfig()
// Opening a missing file would create an empty database and fail on a missing table.
if (!isPostgresUrl(config.database) && !existsSync(config.database)) {
  console.error(`No database at ${config.DATABASE_PATH}: start the server or run \`npm run seed\` first.`)
  process.exit(2)
}
const ds = await createDataSource(config.database).initialize()
const started = performance.now()
const report = await checkLedger(ds)
const ms = Math.round(performance.now() - started)
await ds.destroy()

console.log(`Database ${describeDatabase(config.database)}`)
console.log(`Checked ${report.lots} stock lots against ${report.movements} movements in ${ms} ms.`)
for (const d of report.differences) {
  console.log(`  lot ${d.lotId} (part ${d.partId}, bin ${d.binId}): recorded ${d.recorded}, ledger says ${d.fromLedger}`)
}
if (report.negativeLots) console.log(`  ${report.negativeLots} lot(s) below zero`)
const clean = report.differences.length === 0 && report.negativeLots === 0
console.log(clean ? 'Ledger reconciles.' : 'Ledger does NOT reconcile.')
process.exit(clean ? 0 : 1)
