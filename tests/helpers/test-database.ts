import { randomBytes } from 'node:crypto'
import { join } from 'node:path'
import pg from 'pg'

/**
 * The PostgreSQL server the API tests run against when set (scripts/pg-test.sh sets it to a
 * throw-away cluster); unset, every test file gets a SQLite file of its own.
 */
export const TEST_PG_URL = process.env.TEST_PG_URL
export const onPostgres = Boolean(TEST_PG_URL)

export interface TestDatabase {
  /** What openDatabase takes: the SQLite file path or the postgres:// address. */
  location: string
  /** Removes the PostgreSQL database (the SQLite file goes with its temporary folder). */
  drop: () => Promise<void>
}

async function onServer(sql: string) {
  const client = new pg.Client({ connectionString: TEST_PG_URL })
  await client.connect()
  try { await client.query(sql) } finally { await client.end() }
}

/** An empty database for one test file: a new file in `dir`, or a new PostgreSQL database. */
export async function freshDatabase(dir: string, file = 'test.sqlite'): Promise<TestDatabase> {
  if (!TEST_PG_URL) return { location: join(dir, file), drop: async () => {} }
  const name = `binwright_test_${process.pid}_${randomBytes(4).toString('hex')}`
  await onServer(`CREATE DATABASE "${name}"`)
  const url = new URL(TEST_PG_URL)
  url.pathname = `/${name}`
  return { location: url.toString(), drop: () => onServer(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`) }
}
