import { createHash } from 'node:crypto'
import type { DataSource } from 'typeorm'

/** Tables whose rows change on every request by design (rolling session expiry). */
const VOLATILE = new Set(['sessions'])

/** Every table's name, on SQLite or PostgreSQL. */
export async function tableNames(ds: DataSource): Promise<string[]> {
  const rows = ds.options.type === 'postgres'
    ? await ds.query("SELECT tablename AS name FROM pg_tables WHERE schemaname = current_schema() ORDER BY tablename")
    : await ds.query("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name")
  return (rows as { name: string }[]).map((r) => r.name)
}

/** A SHA-256 over every row of every table (in a fixed order): equal digests, unchanged data. */
export async function databaseDigest(ds: DataSource): Promise<string> {
  const order = ds.options.type === 'postgres' ? '1' : 'rowid'
  const hash = createHash('sha256')
  for (const name of await tableNames(ds)) {
    if (VOLATILE.has(name)) continue
    // PostgreSQL: ORDER BY 1 sorts by each table's first column (its id or key).
    const rows = await ds.query(`SELECT * FROM "${name}" ORDER BY ${order}`) as unknown[]
    hash.update(`${name}\n${JSON.stringify(rows)}\n`)
  }
  return hash.digest('hex')
}
