import { In, type EntityManager } from 'typeorm'
import { db } from '../db'
import { Reservation, StockLot } from '../entities'

export interface StockTotals {
  onHand: number
  reserved: number
  /** on hand − reserved; negative when reservations exceed what is left (after a count). */
  available: number
}

const ZERO: StockTotals = { onHand: 0, reserved: 0, available: 0 }

/**
 * On hand, reserved and available for each part, in two grouped queries (no N+1).
 * Pass the transaction's manager when the answer must be consistent with a write.
 */
export async function stockTotals(partIds: number[], tx?: EntityManager): Promise<Map<number, StockTotals>> {
  const m = tx ?? db().manager
  const result = new Map<number, StockTotals>()
  if (partIds.length === 0) return result
  const ids = [...new Set(partIds)]
  const onHand: { partId: number; total: number }[] = await m.createQueryBuilder(StockLot, 'l')
    .select('l.partId', 'partId').addSelect('SUM(l.quantity)', 'total')
    .where({ partId: In(ids) }).groupBy('l.partId').getRawMany()
  const reserved: { partId: number; total: number }[] = await m.createQueryBuilder(Reservation, 'r')
    .select('r.partId', 'partId').addSelect('SUM(r.quantity)', 'total')
    .where({ partId: In(ids) }).groupBy('r.partId').getRawMany()
  for (const id of ids) result.set(id, { ...ZERO })
  for (const r of onHand) result.get(Number(r.partId))!.onHand = Number(r.total)
  for (const r of reserved) result.get(Number(r.partId))!.reserved = Number(r.total)
  for (const t of result.values()) t.available = t.onHand - t.reserved
  return result
}

export async function stockTotalsOf(partId: number, tx?: EntityManager): Promise<StockTotals> {
  return (await stockTotals([partId], tx)).get(partId) ?? { ...ZERO }
}
