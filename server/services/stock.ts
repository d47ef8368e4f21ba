import type { EntityManager } from 'typeorm'
import { Bin, Part, StockLot, type Movement } from '../entities'
import { badRequest, conflict, notFound } from '../errors'
import { inTransaction } from '../db'
import { countLotFor, postMovement } from './ledger'
import { receiveInput, type ReceiveInput } from '../../shared/schemas/stock'
import { stockModeOf } from '../../shared/types/domain'

/** A bin that exists and takes stock (not retired), read inside the transaction. */
export async function openBin(tx: EntityManager, binId: number): Promise<Bin> {
  const bin = await tx.findOneBy(Bin, { id: binId })
  if (!bin) throw notFound('The bin')
  if (bin.retired) throw conflict('BIN_RETIRED', `Bin ${bin.code} is retired and takes no stock.`)
  return bin
}

export async function activePart(tx: EntityManager, partId: number): Promise<Part> {
  const part = await tx.findOneBy(Part, { id: partId })
  if (!part) throw notFound('The part')
  if (part.archived) throw conflict('PART_ARCHIVED', `${part.code} is archived; restore it before moving stock.`)
  return part
}

/**
 * Receives stock into a bin inside the caller's transaction: one movement per counted
 * receipt or batch, one per bar piece (each piece is a lot of its own).
 */
export async function receiveInto(tx: EntityManager, raw: ReceiveInput, userId: number): Promise<Movement[]> {
  const input = receiveInput.parse(raw)
  const part = await activePart(tx, input.partId)
  await openBin(tx, input.binId)
  const mode = stockModeOf(part.kind)
  const link = { purchaseOrderId: input.purchaseOrderId, userId, reason: input.reason }
  if (mode === 'length') {
    const moves: Movement[] = []
    for (let i = 0; i < input.pieces; i++) {
      const lot = await tx.save(StockLot, { partId: part.id, binId: input.binId, quantity: 0, batchCode: null, expiresOn: null })
      moves.push(await postMovement(tx, { kind: 'receive', partId: part.id, quantity: input.quantity, toLotId: lot.id, ...link }))
    }
    return moves
  }
  if (input.pieces !== 1) throw badRequest('PIECES_FOR_BAR_ONLY', 'Pieces apply to bar, tube and sheet stock only.')
  let lot: StockLot
  if (mode === 'batch') {
    if (!input.expiresOn) throw badRequest('EXPIRY_REQUIRED', `${part.code} is kept by batch: give the expiry date.`)
    const batchCode = input.batchCode || `${input.expiresOn}`
    lot = (await tx.findOneBy(StockLot, { partId: part.id, binId: input.binId, batchCode, expiresOn: input.expiresOn }))
      ?? await tx.save(StockLot, { partId: part.id, binId: input.binId, quantity: 0, batchCode, expiresOn: input.expiresOn })
  } else {
    if (!Number.isInteger(input.quantity)) throw badRequest('WHOLE_ITEMS', `${part.code} is counted in whole items.`)
    lot = await countLotFor(tx, part.id, input.binId)
  }
  return [await postMovement(tx, { kind: 'receive', partId: part.id, quantity: input.quantity, toLotId: lot.id, ...link })]
}

/** POST /api/stock/receive: one transaction, all or nothing. */
export const receiveStock = (raw: ReceiveInput, userId: number) =>
  inTransaction((tx) => receiveInto(tx, raw, userId))
