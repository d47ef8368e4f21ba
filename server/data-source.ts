import 'reflect-metadata'
import { mkdirSync } from 'node:fs'
import { dirname } from 'node:path'
import { DataSource } from 'typeorm'
import { entities } from './entities'
import { migrations } from './migrations'

/** Milliseconds a writer waits for SQLite's lock before giving up (another process writing). */
const BUSY_TIMEOUT_MS = 5000

/**
 * The one DataSource definition: used by the app, the seeds, the tests and the TypeORM CLI.
 * WAL lets readers go on while a write commits; foreign keys are off by default in SQLite.
 */
export function createDataSource(databasePath: string): DataSource {
  if (databasePath !== ':memory:') mkdirSync(dirname(databasePath), { recursive: true })
  return new DataSource({
    type: 'better-sqlite3',
    database: databasePath,
    enableWAL: true,
    prepareDatabase: (db: { pragma: (s: string) => unknown }) => {
      db.pragma('foreign_keys = ON')
      db.pragma(`busy_timeout = ${BUSY_TIMEOUT_MS}`)
      // WAL with NORMAL sync is durable across application crashes (not OS power loss).
      db.pragma('synchronous = NORMAL')
    },
    entities,
    migrations,
    migrationsRun: false,
    synchronize: false,
    logging: false,
  })
}

/** Target of the TypeORM CLI's `-d` (migration:generate / migration:run). */
export default createDataSource(process.env.DATABASE_PATH ?? 'data/binwright.sqlite')
