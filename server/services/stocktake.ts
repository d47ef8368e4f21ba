import { In } from 'typeorm'
import { inTransaction } from '../db'
import { Bin, Part, StockLot } from '../entities'
import { conflict } from '../errors'
import { countBin } from './stock-count'
import { isZero } from './stock-guards'
import { toMovementDtos } from './movements'
import { stockTakeInput, type StockTakeInput } from '../../shared/schemas/stocktake'
import type { StaleCountDto, StockTakeResultDto } from '../../shared/types/bin-page'
import type { Movement } from '../entities'

/**
 * Applies a stock-take over many bins in one transaction. A lot whose record changed after it
 * was counted (someone took or put back in between) is refused with 409 COUNT_STALE, listing
 * each one, so it is recounted rather than the count silently undoing that movement.
 */
export async function applyStockTake(raw: StockTakeInput, userId: number): Promise<StockTakeResultDto> {
  const input = stockTakeInput.parse(raw)
  const moves = await inTransaction(async (tx) => {
    const checked = input.bins.flatMap((b) => b.lines.filter((l) => l.lotId && l.expected !== undefined).map((l) => ({ binId: b.binId, ...l })))
    const lots = checked.length ? await tx.findBy(StockLot, { id: In(checked.map((l) => l.lotId!)) }) : []
    const stale: StaleCountDto[] = []
    for (const line of checked) {
      const lot = lots.find((l) => l.id === line.lotId)
      if (lot && !isZero(lot.quantity - line.expected!)) {
        stale.push({ binId: line.binId, binCode: '', lotId: lot.id, partCode: String(lot.partId), expected: line.expected!, now: lot.quantity })
      }
    }
    if (stale.length) throw await staleError(tx, stale)
    const all: Movement[] = []
    for (const bin of input.bins) {
      const lines = bin.lines.map(({ expected: _expected, ...line }) => line)
      if (lines.length) all.push(...await countBin(tx, { binId: bin.binId, lines, userId, reason: input.reason }))
    }
    return all
  })
  return { bins: input.bins.length, movements: await toMovementDtos(moves) }
}

async function staleError(tx: Parameters<Parameters<typeof inTransaction>[0]>[0], stale: StaleCountDto[]) {
  const bins = new Map((await tx.findBy(Bin, { id: In(stale.map((s) => s.binId)) })).map((b) => [b.id, b.code]))
  const lots = await tx.findBy(StockLot, { id: In(stale.map((s) => s.lotId)) })
  const parts = new Map((await tx.findBy(Part, { id: In(lots.map((l) => l.partId)) })).map((p) => [p.id, p.code]))
  for (const s of stale) {
    s.binCode = bins.get(s.binId) ?? '?'
    s.partCode = parts.get(lots.find((l) => l.id === s.lotId)!.partId) ?? '?'
  }
  const where = [...new Set(stale.map((s) => s.binCode))].join(', ')
  return conflict('COUNT_STALE', `Stock moved in ${where} after it was counted; count ${stale.length > 1 ? 'those bins' : 'that bin'} again. Nothing was changed.`, stale)
}
