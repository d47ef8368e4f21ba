import { EventEmitter } from 'node:events'
import type { DataSource, EntityManager } from 'typeorm'

let current: DataSource | undefined
/** Tail of the write queue: each stock-changing transaction starts after the previous ends. */
let queue: Promise<unknown> = Promise.resolve()
/** Parts whose stock or reservations a running transaction changed. */
const touched = new WeakMap<EntityManager, Set<number>>()

/**
 * Emits 'stock-changed' with the ids of the parts a committed transaction touched, so alerts
 * and other followers can react without every service calling them.
 */
export const stockEvents = new EventEmitter()

/** Makes `ds` the database the services use (one per process; tests make one per file). */
export function useDataSource(ds: DataSource) {
  current = ds
  queue = Promise.resolve()
}

export function db(): DataSource {
  if (!current) throw new Error('No database: call useDataSource() at start-up')
  return current
}

/** Notes that this transaction changed a part's stock or reservations. */
export function touchPart(tx: EntityManager, partId: number) {
  touched.get(tx)?.add(partId)
}

/**
 * Runs `work` in a database transaction, one at a time.
 * TypeORM's better-sqlite3 driver shares one connection, so two overlapping transactions
 * interleave their statements and one ends up in autocommit (see the stack notes). A promise
 * chain makes writers take turns; readers are not held up. Use only the `tx` it gives you.
 */
export function inTransaction<T>(work: (tx: EntityManager) => Promise<T>): Promise<T> {
  const ds = db()
  const parts = new Set<number>()
  const run = queue.then(() => ds.transaction((tx) => {
    touched.set(tx, parts)
    return work(tx)
  }))
  queue = run.catch(() => undefined)
  return run.then((result) => {
    if (parts.size) stockEvents.emit('stock-changed', [...parts])
    return result
  })
}
