import { createHash } from 'node:crypto'
import type { DataSource } from 'typeorm'

/** Tables whose rows change on every request by design (rolling session expiry). */
const VOLATILE = new Set(['sessions'])

/** A SHA-256 over every row of every table (in rowid order): equal digests, unchanged data. */
export async function databaseDigest(ds: DataSource): Promise<string> {
  const tables = await ds.query("SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name") as { name: string }[]
  const hash = createHash('sha256')
  for (const { name } of tables) {
    if (VOLATILE.has(name)) continue
    const rows = await ds.query(`SELECT * FROM "${name}" ORDER BY rowid`) as unknown[]
    hash.update(`${name}\n${JSON.stringify(rows)}\n`)
  }
  return hash.digest('hex')
}
