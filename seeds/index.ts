/** `npm run seed`: loads the demo scenario into an empty database (migrations run first). */
import { loadConfig } from '../server/config'
import { openDatabase } from '../server/database'
import { describeDatabase } from '../server/data-source'
import { isEmpty, seedDemo } from './demo'

const config = loadConfig()
const ds = await openDatabase(config.database)
if (await isEmpty(ds)) {
  await seedDemo(ds)
  console.log(`Demo scenario loaded into ${describeDatabase(config.database)}.`)
} else {
  console.log(`${describeDatabase(config.database)} already has stores data; the demo was not loaded.`)
}
await ds.destroy()
