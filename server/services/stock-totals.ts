import { In, type EntityManager } from 'typeorm'
import { db } from '../db'
import { Part, Reservation, StockLot } from '../entities'

export interface StockTotals {
  onHand: number
  reserved: number
  /** on hand − reserved; negative when reservations exceed what is left (after a count). */
  available: number
}

const ZERO: StockTotals = { onHand: 0, reserved: 0, available: 0 }

/**
 * On PostgreSQL, locks the parts' rows (SELECT … FOR UPDATE, in id order so two transactions
 * cannot deadlock) until the transaction ends: another server process or pool connection
 * deciding on the same parts' free stock waits for this one to commit. SQLite needs no lock:
 * this process runs its writers one at a time (inTransaction), and SQLite lets one process
 * write at a time, refusing a writer whose earlier reads went stale.
 */
export async function lockParts(tx: EntityManager, partIds: number[]) {
  const inWrite = tx.queryRunner?.isTransactionActive
  if (tx.connection.options.type !== 'postgres' || !inWrite || partIds.length === 0) return
  const ids = [...new Set(partIds)].sort((a, b) => a - b)
  await tx.createQueryBuilder(Part, 'p').select('p.id').where({ id: In(ids) })
    .orderBy('p.id').setLock('pessimistic_write').getMany()
}

/**
 * On hand, reserved and available for each part, in two grouped queries (no N+1).
 * Pass the transaction's manager when the answer must be consistent with a write: the parts
 * are then locked until it commits (see lockParts).
 */
export async function stockTotals(partIds: number[], tx?: EntityManager): Promise<Map<number, StockTotals>> {
  const m = tx ?? db().manager
  const result = new Map<number, StockTotals>()
  if (partIds.length === 0) return result
  const ids = [...new Set(partIds)]
  if (tx) await lockParts(tx, ids) // a plain read (a manager outside any transaction) locks nothing
  const onHand: { partId: number; total: number }[] = await m.createQueryBuilder(StockLot, 'l')
    .select('l.partId', 'partId').addSelect('SUM(l.quantity)', 'total')
    .where({ partId: In(ids) }).groupBy('l.partId').getRawMany()
  const reserved = await reservedTotals(ids, m)
  for (const id of ids) result.set(id, { ...ZERO, reserved: reserved.get(id) ?? 0 })
  for (const r of onHand) result.get(Number(r.partId))!.onHand = Number(r.total)
  for (const t of result.values()) t.available = t.onHand - t.reserved
  return result
}

/** Σ reserved per part, in one grouped query (parts with nothing reserved are absent). */
export async function reservedTotals(partIds: number[], m: EntityManager = db().manager): Promise<Map<number, number>> {
  if (partIds.length === 0) return new Map()
  const rows: { partId: number; total: number }[] = await m.createQueryBuilder(Reservation, 'r')
    .select('r.partId', 'partId').addSelect('SUM(r.quantity)', 'total')
    .where({ partId: In(partIds) }).groupBy('r.partId').getRawMany()
  return new Map(rows.map((r) => [Number(r.partId), Number(r.total)]))
}

export async function stockTotalsOf(partId: number, tx?: EntityManager): Promise<StockTotals> {
  return (await stockTotals([partId], tx)).get(partId) ?? { ...ZERO }
}
