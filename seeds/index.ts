/** `npm run seed`: loads the demo scenario into an empty database (migrations run first). */
import { loadConfig } from '../server/config'
import { openDatabase } from '../server/database'
import { isEmpty, seedDemo } from './demo'

const config = loadConfig()
const ds = await openDatabase(config.DATABASE_PATH)
if (await isEmpty(ds)) {
  await seedDemo(ds)
  console.log(`Demo scenario loaded into ${config.DATABASE_PATH}.`)
} else {
  console.log(`${config.DATABASE_PATH} already has stores data; the demo was not loaded.`)
}
await ds.destroy()
