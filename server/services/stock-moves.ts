import { IsNull, type EntityManager } from 'typeorm'
import { StockLot, type Movement, type Part } from '../entities'
import { badRequest, conflict } from '../errors'
import { countLotFor, postMovement } from './ledger'
import { activePart, assertWholeItems, isZero, lotOf, openBin, show } from './stock-guards'
import { stockModeOf } from '../../shared/types/domain'

/** The lot of one batch in a bin, made empty if the bin has none yet. */
export async function batchLotFor(tx: EntityManager, partId: number, binId: number, batchCode: string, expiresOn: string) {
  return (await tx.findOneBy(StockLot, { partId, binId, batchCode, expiresOn }))
    ?? tx.save(StockLot, { partId, binId, quantity: 0, batchCode, expiresOn })
}

/** A new, empty lot for one bar piece (each piece and offcut is its own lot). */
export const newPieceLot = (tx: EntityManager, partId: number, binId: number) =>
  tx.save(StockLot, { partId, binId, quantity: 0, batchCode: null, expiresOn: null })

/** Where stock of `part` from `source` lands in bin `binId`: same batch, a new piece, or the count lot. */
async function destinationLot(tx: EntityManager, part: Part, binId: number, source?: { batchCode: string | null; expiresOn: string | null }) {
  const mode = stockModeOf(part.kind)
  if (mode === 'length') return newPieceLot(tx, part.id, binId)
  if (mode === 'batch') {
    if (!source?.batchCode || !source.expiresOn) {
      throw badRequest('BATCH_REQUIRED', `${part.code} is kept by batch: give the batch (or its code and expiry date).`)
    }
    return batchLotFor(tx, part.id, binId, source.batchCode, source.expiresOn)
  }
  return countLotFor(tx, part.id, binId)
}

export interface ReturnToBinInput {
  partId: number
  binId: number
  quantity: number
  /** Batches: the batch the containers came from; bar: ignored (an offcut is a new piece). */
  lotId?: number
  batchCode?: string
  expiresOn?: string
  buildId?: number | null
  userId: number
  reason?: string
}

/** Puts parts back into a bin: counted into its lot, a bar offcut as a new piece, a batch into its batch. */
export async function returnToBin(tx: EntityManager, input: ReturnToBinInput): Promise<Movement> {
  const part = await activePart(tx, input.partId)
  await openBin(tx, input.binId)
  assertWholeItems(part, input.quantity)
  const source = input.lotId ? await lotOf(tx, input.lotId, part.id) : { batchCode: input.batchCode ?? null, expiresOn: input.expiresOn ?? null }
  const lot = await destinationLot(tx, part, input.binId, source)
  return postMovement(tx, {
    kind: 'return', partId: part.id, quantity: input.quantity, toLotId: lot.id,
    buildId: input.buildId ?? null, userId: input.userId, reason: input.reason ?? '',
  })
}

export interface MoveStockInput {
  /** A counted part moves by part + bin; bar pieces and batches by lot. */
  partId?: number
  fromBinId?: number
  lotId?: number
  toBinId: number
  /** Omit to move everything in the lot; a bar piece always moves whole. */
  quantity?: number
  userId: number
  reason?: string
}

/** Moves stock between bins as one 'move' movement out of one lot and into another. */
export async function moveStock(tx: EntityManager, input: MoveStockInput): Promise<Movement> {
  const toBin = await openBin(tx, input.toBinId)
  const source = await sourceLot(tx, input)
  const part = await activePart(tx, source.partId)
  if (source.binId === toBin.id) throw badRequest('SAME_BIN', `That stock is already in bin ${toBin.code}.`)
  const quantity = input.quantity ?? source.quantity
  if (isZero(source.quantity)) throw conflict('INSUFFICIENT_STOCK', `There is no ${part.code} there to move. Nothing was changed.`)
  assertWholeItems(part, quantity)
  if (stockModeOf(part.kind) === 'length' && !isZero(quantity - source.quantity)) {
    throw badRequest('WHOLE_PIECE', `A bar piece moves whole (${show(source.quantity)} mm); cut it with a take first.`)
  }
  const dest = await destinationLot(tx, part, toBin.id, source)
  return postMovement(tx, {
    kind: 'move', partId: part.id, quantity, fromLotId: source.id, toLotId: dest.id,
    userId: input.userId, reason: input.reason ?? '',
  })
}

async function sourceLot(tx: EntityManager, input: MoveStockInput): Promise<StockLot> {
  if (input.lotId) return lotOf(tx, input.lotId, input.partId)
  const part = await activePart(tx, input.partId!)
  if (stockModeOf(part.kind) !== 'count') {
    throw badRequest('LOT_REQUIRED', `${part.code} is kept by ${part.kind === 'stock' ? 'piece' : 'batch'}: choose which one to move.`)
  }
  const lot = await tx.findOneBy(StockLot, { partId: part.id, binId: input.fromBinId!, batchCode: IsNull() })
  if (!lot) throw conflict('INSUFFICIENT_STOCK', `There is no ${part.code} in that bin. Nothing was changed.`)
  return lot
}

export interface AdjustStockInput {
  lotId?: number
  partId?: number
  binId?: number
  /** Signed: + found, − lost or damaged. */
  delta: number
  userId: number
  reason: string
}

/** A storekeeper's correction of one lot by a signed difference, with the reason in the ledger. */
export async function adjustStock(tx: EntityManager, input: AdjustStockInput): Promise<Movement> {
  let lot: StockLot
  if (input.lotId) lot = await lotOf(tx, input.lotId, input.partId)
  else {
    const part = await activePart(tx, input.partId!)
    if (stockModeOf(part.kind) !== 'count') throw badRequest('LOT_REQUIRED', `${part.code} is kept by piece or batch: choose the lot.`)
    await openBin(tx, input.binId!)
    lot = await countLotFor(tx, part.id, input.binId!)
  }
  const part = await activePart(tx, lot.partId)
  assertWholeItems(part, Math.abs(input.delta))
  if (input.delta > 0) await openBin(tx, lot.binId)
  return postMovement(tx, {
    kind: 'adjust', partId: part.id, quantity: Math.abs(input.delta),
    ...(input.delta > 0 ? { toLotId: lot.id } : { fromLotId: lot.id }),
    userId: input.userId, reason: input.reason,
  })
}
