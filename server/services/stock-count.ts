import { IsNull, type EntityManager } from 'typeorm'
import { StockLot, type Movement } from '../entities'
import { badRequest } from '../errors'
import { postMovement } from './ledger'
import { batchLotFor, newPieceLot } from './stock-moves'
import { activePart, assertWholeItems, isZero, lotOf, openBin } from './stock-guards'
import { stockModeOf } from '../../shared/types/domain'

export interface CountLine {
  /** A lot already recorded in the bin. */
  lotId?: number
  /** A part found in the bin: its count lot, a batch (batchCode + expiresOn) or a new bar piece. */
  partId?: number
  counted: number
  batchCode?: string
  expiresOn?: string
}

export interface CountBinInput {
  binId: number
  lines: CountLine[]
  userId: number
  reason?: string
}

/**
 * Stock-take of one bin: each counted line that differs from the record becomes one 'count'
 * movement (up or down) with the reason; equal lines write nothing; lots not listed are left
 * alone. All lines apply together or not at all (the caller's transaction).
 */
export async function countBin(tx: EntityManager, input: CountBinInput): Promise<Movement[]> {
  const bin = await openBin(tx, input.binId)
  const seen = new Set<number>()
  const moves: Movement[] = []
  for (const [i, line] of input.lines.entries()) {
    const lot = await lotForLine(tx, bin.id, line, i)
    if (!lot) continue
    if (seen.has(lot.id)) throw badRequest('DUPLICATE_LINE', `Line ${i + 1} counts the same stock as an earlier line.`)
    seen.add(lot.id)
    const part = await activePart(tx, lot.partId)
    assertWholeItems(part, line.counted)
    const diff = line.counted - lot.quantity
    if (isZero(diff)) continue
    moves.push(await postMovement(tx, {
      kind: 'count', partId: part.id, quantity: Math.abs(diff),
      ...(diff > 0 ? { toLotId: lot.id } : { fromLotId: lot.id }),
      userId: input.userId, reason: input.reason || 'Stock-take',
    }))
  }
  return moves
}

/** The lot a count line is about; undefined when a newly found line counted nothing. */
async function lotForLine(tx: EntityManager, binId: number, line: CountLine, i: number): Promise<StockLot | undefined> {
  if (line.lotId) {
    const lot = await lotOf(tx, line.lotId, line.partId)
    if (lot.binId !== binId) throw badRequest('LOT_NOT_IN_BIN', `Line ${i + 1}: that lot is in another bin.`)
    return lot
  }
  const part = await activePart(tx, line.partId!)
  const mode = stockModeOf(part.kind)
  if (mode === 'count') {
    const lot = await tx.findOneBy(StockLot, { partId: part.id, binId, batchCode: IsNull() })
    if (lot || line.counted === 0) return lot ?? undefined
    return tx.save(StockLot, { partId: part.id, binId, quantity: 0, batchCode: null, expiresOn: null })
  }
  if (line.counted === 0) return undefined
  if (mode === 'length') return newPieceLot(tx, part.id, binId)
  if (!line.batchCode || !line.expiresOn) {
    throw badRequest('BATCH_REQUIRED', `Line ${i + 1}: ${part.code} is kept by batch; give the batch code and expiry date.`)
  }
  return batchLotFor(tx, part.id, binId, line.batchCode, line.expiresOn)
}
