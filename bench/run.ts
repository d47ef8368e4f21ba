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

const suites: { name: string; run: () => Promise<void> }[] = [baselineSuite]
suites.push(uploadsSuite)
suites.push(partsSearchSuite)
suites.push(reservationsSuite)
suites.push(labelsSuite)

for (const suite of suites) {
  console.log(`\n— ${suite.name}`)
  await suite.run()
}
writeResults()
process.exit(0)
