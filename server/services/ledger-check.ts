import type { DataSource } from 'typeorm'
import { QUANTITY_EPSILON } from './ledger'

export interface LedgerDifference {
  lotId: number
  partId: number
  binId: number
  recorded: number
  fromLedger: number
}

interface LedgerRow { id: number; partId: number; binId: number; quantity: number; fromLedger: number }

export interface LedgerReport {
  lots: number
  movements: number
  negativeLots: number
  differences: LedgerDifference[]
}

/**
 * Recomputes every lot's quantity from the ledger and lists the lots that disagree.
 * Plain SQL that runs on SQLite and PostgreSQL alike (quoted camelCase names, numbers via Number).
 */
export async function checkLedger(ds: DataSource): Promise<LedgerReport> {
  const raw: Record<keyof LedgerRow, unknown>[] = await ds.query(`
      SELECT l.id AS "id", l."partId" AS "partId", l."binId" AS "binId", l.quantity AS "quantity",
        COALESCE((SELECT SUM(m.quantity) FROM movements m WHERE m."toLotId" = l.id), 0)
        - COALESCE((SELECT SUM(m.quantity) FROM movements m WHERE m."fromLotId" = l.id), 0) AS "fromLedger"
      FROM stock_lots l`)
  const rows = raw.map((r) => ({
    id: Number(r.id), partId: Number(r.partId), binId: Number(r.binId), quantity: Number(r.quantity), fromLedger: Number(r.fromLedger),
  }))
  const [{ n }] = await ds.query('SELECT COUNT(*) AS n FROM movements')
  const differences = rows
    .filter((r) => Math.abs(r.quantity - r.fromLedger) > QUANTITY_EPSILON * 1000)
    .map((r) => ({ lotId: r.id, partId: r.partId, binId: r.binId, recorded: r.quantity, fromLedger: r.fromLedger }))
  return {
    lots: rows.length,
    movements: Number(n),
    negativeLots: rows.filter((r) => r.quantity < -QUANTITY_EPSILON).length,
    differences,
  }
}
