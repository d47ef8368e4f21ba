import 'reflect-metadata'
import { mkdirSync } from 'node:fs'
import { dirname } from 'node:path'
import { DataSource } from 'typeorm'
import { POSTGRES_URL } from './config'
import { entities } from './entities'
import { postgresMigrations, sqliteMigrations } from './migrations'

/** Milliseconds a writer waits for SQLite's lock before giving up (another process writing). */
const BUSY_TIMEOUT_MS = 5000
/** Prepared SQLite statements TypeORM keeps (its default is 100). */
const STATEMENT_CACHE_SIZE = 1000

/** True for a PostgreSQL address (DATABASE_URL); anything else is a SQLite file path. */
export const isPostgresUrl = (location: string) => POSTGRES_URL.test(location)

/** The database location fit for a log line: a PostgreSQL address loses its password. */
export function describeDatabase(location: string): string {
  if (!isPostgresUrl(location)) return location
  const url = new URL(location)
  if (url.password) url.password = '***'
  return url.toString()
}

/**
 * The one DataSource definition: used by the app, the seeds, the tests and the TypeORM CLI.
 * `location` is a SQLite file path or a postgres:// address; both run the same entities.
 */
export function createDataSource(location: string): DataSource {
  return isPostgresUrl(location) ? postgresDataSource(location) : sqliteDataSource(location)
}

/** WAL lets readers go on while a write commits; foreign keys are off by default in SQLite. */
function sqliteDataSource(path: string): DataSource {
  if (path !== ':memory:') mkdirSync(dirname(path), { recursive: true })
  return bindWholeNumbers(new DataSource({
    type: 'better-sqlite3',
    database: path,
    enableWAL: true,
    // Prepared statements kept, first in first out; every distinct SQL text the app makes fits.
    statementCacheSize: STATEMENT_CACHE_SIZE,
    prepareDatabase: (db: { pragma: (s: string) => unknown }) => {
      db.pragma('foreign_keys = ON')
      db.pragma(`busy_timeout = ${BUSY_TIMEOUT_MS}`)
      // WAL with NORMAL sync is durable across application crashes (not OS power loss).
      db.pragma('synchronous = NORMAL')
    },
    entities,
    migrations: sqliteMigrations,
    migrationsRun: false,
    synchronize: false,
    logging: false,
  }))
}

/**
 * TypeORM's SQLite driver writes number parameters into the SQL text (`WHERE "id" = 42`), so
 * each id made a statement of its own: SQLite parsed and planned it afresh, and the one-off
 * statements pushed the app's repeated ones out of TypeORM's statement cache. Here whole numbers
 * are bound as parameters instead, so one prepared statement serves every id. They are bound as
 * BigInt, which better-sqlite3 binds as INTEGER, as the literal was (a JS number would be bound as
 * REAL: `10 / ?` would give 2.5, and a text column would store '42.0'). Other values are unchanged.
 */
function bindWholeNumbers(ds: DataSource): DataSource {
  const driver = ds.driver
  const escape = driver.escapeQueryWithParameters.bind(driver)
  const bind = (v: unknown) => (typeof v === 'number' && Number.isSafeInteger(v) ? BigInt(v) : v)
  driver.escapeQueryWithParameters = (sql: string, parameters: Record<string, unknown>) => {
    const bound: Record<string, unknown> = {}
    for (const key in parameters) {
      const v = parameters[key]
      bound[key] = Array.isArray(v) ? v.map(bind) : bind(v)
    }
    return escape(sql, bound)
  }
  return ds
}

/** For a society sharing one server among several workshops; a small pool is plenty. */
function postgresDataSource(url: string): DataSource {
  return new DataSource({
    type: 'postgres',
    url,
    extra: { max: 10 },
    entities,
    migrations: postgresMigrations,
    migrationsRun: false,
    synchronize: false,
    logging: false,
  })
}

/** Target of the TypeORM CLI's `-d` (migration:generate / migration:run). */
export default createDataSource(process.env.DATABASE_URL ?? process.env.DATABASE_PATH ?? 'data/binwright.sqlite')
