import type { DataSource, EntityManager } from 'typeorm'

let current: DataSource | undefined
/** Tail of the write queue: each stock-changing transaction starts after the previous ends. */
let queue: Promise<unknown> = Promise.resolve()

/** Makes `ds` the database the services use (one per process; tests make one per file). */
export function useDataSource(ds: DataSource) {
  current = ds
  queue = Promise.resolve()
}

export function db(): DataSource {
  if (!current) throw new Error('No database: call useDataSource() at start-up')
  return current
}

/**
 * Runs `work` in a database transaction, one at a time.
 * TypeORM's better-sqlite3 driver shares one connection, so two overlapping transactions
 * interleave their statements and one ends up in autocommit (see the stack notes). A promise
 * chain makes writers take turns; readers are not held up. Use only the `tx` it gives you.
 */
export function inTransaction<T>(work: (tx: EntityManager) => Promise<T>): Promise<T> {
  const ds = db()
  const run = queue.then(() => ds.transaction(work))
  queue = run.catch(() => undefined)
  return run
}
