/**
 * `npm run bench`: measures the goal figures in one run and writes bench/results.json.
 * Timings are reported beside a baseline measured in the same run where one exists.
 * Each feature adds a module to `suites` below.
 */
import { writeResults } from './harness'
import { baselineSuite } from './suites/baseline'
import { uploadsSuite } from './suites/uploads'
import { partsSearchSuite } from './suites/parts-search'
import { reservationsSuite } from './suites/reservations'
import { labelsSuite } from './suites/labels'
import { clientBundleSuite } from './suites/client-bundle'
import { binsSuite } from './suites/bins'
import { ledgerSuite } from './suites/ledger'
import { record } from './harness'

const suites: { name: string; run: () => Promise<void> }[] = [baselineSuite]
// Builds the client into a private folder first; the browser suites serve that build.
suites.push(clientBundleSuite)
suites.push(uploadsSuite)
suites.push(partsSearchSuite)
suites.push(reservationsSuite)
suites.push(binsSuite)
suites.push(ledgerSuite)
suites.push(labelsSuite)

const only = process.env.BENCH_ONLY?.split(',')
const started = performance.now()
for (const suite of suites) {
  if (only && !only.some((o) => suite.name.startsWith(o))) continue
  console.log(`\n— ${suite.name}`)
  await suite.run()
}
record({ figure: 'whole benchmark run', value: (performance.now() - started) / 1000, unit: 's', goal: '< 600 s', pass: performance.now() - started < 600_000 })
writeResults()
process.exit(0)
