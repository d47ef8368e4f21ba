import type { EntityManager } from 'typeorm'
import { StockLot, type Movement } from '../entities'
import { badRequest } from '../errors'
import { inTransaction } from '../db'
import { countLotFor, postMovement } from './ledger'
import { activePart, openBin } from './stock-guards'
import { drawFromLots } from './stock-draw'
import { adjustStock, batchLotFor, moveStock, returnToBin } from './stock-moves'
import { countBin } from './stock-count'
import { reverseMovement } from './stock-reverse'
import { toMovementDtos } from './movements'
import {
  adjustInput, countInput, moveInput, receiveInput, returnInput, reverseInput, takeInput,
  type AdjustInput, type CountInput, type MoveInput, type ReceiveInput, type ReturnInput, type ReverseInput, type TakeInput,
} from '../../shared/schemas/stock'
import { stockModeOf } from '../../shared/types/domain'
import type { Role } from '../../shared/types/api'
import type { StockResultDto } from '../../shared/types/stock'

/*
 * The stock service: every change goes through postMovement inside inTransaction. The
 * functions taking `tx` are for other services to call inside their own transactions
 * (builds draw with drawFromLots, orders receive with receiveInto, the bin page counts …).
 */
export { openBin, activePart } from './stock-guards'
export { drawFromLots, type DrawInput } from './stock-draw'
export { returnToBin, moveStock, adjustStock, type ReturnToBinInput, type MoveStockInput, type AdjustStockInput } from './stock-moves'
export { countBin, type CountBinInput, type CountLine } from './stock-count'
export { reverseMovement } from './stock-reverse'

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
    lot = await batchLotFor(tx, part.id, input.binId, input.batchCode || `${input.expiresOn}`, input.expiresOn)
  } else {
    if (!Number.isInteger(input.quantity)) throw badRequest('WHOLE_ITEMS', `${part.code} is counted in whole items.`)
    lot = await countLotFor(tx, part.id, input.binId)
  }
  return [await postMovement(tx, { kind: 'receive', partId: part.id, quantity: input.quantity, toLotId: lot.id, ...link })]
}

/** The acting user as routes know it. */
export interface Actor {
  id: number
  role: Role
}

/** Runs one stock change in its own transaction and answers with the ledger rows it wrote. */
async function recorded(work: (tx: EntityManager) => Promise<Movement | Movement[]>): Promise<StockResultDto> {
  const result = await inTransaction(work)
  return { movements: await toMovementDtos(Array.isArray(result) ? result : [result]) }
}

/** POST /api/stock/receive: one transaction, all or nothing. */
export const receiveStock = (raw: ReceiveInput, userId: number) =>
  inTransaction((tx) => receiveInto(tx, raw, userId))

export const receiveStockDto = (raw: ReceiveInput, actor: Actor) => recorded((tx) => receiveInto(tx, raw, actor.id))

export const takeStock = (raw: TakeInput, actor: Actor) => {
  const input = takeInput.parse(raw)
  return recorded((tx) => drawFromLots(tx, { ...input, userId: actor.id, role: actor.role }))
}

export const returnStock = (raw: ReturnInput, actor: Actor) => {
  const input = returnInput.parse(raw)
  return recorded((tx) => returnToBin(tx, { ...input, userId: actor.id }))
}

export const moveStockBetweenBins = (raw: MoveInput, actor: Actor) => {
  const input = moveInput.parse(raw)
  return recorded((tx) => moveStock(tx, { ...input, userId: actor.id }))
}

export const adjustStockLot = (raw: AdjustInput, actor: Actor) => {
  const input = adjustInput.parse(raw)
  return recorded((tx) => adjustStock(tx, { ...input, userId: actor.id }))
}

export const countStock = (raw: CountInput, actor: Actor) => {
  const input = countInput.parse(raw)
  return recorded((tx) => countBin(tx, { ...input, userId: actor.id }))
}

export const reverseStockMovement = (id: number, raw: ReverseInput, actor: Actor) => {
  const input = reverseInput.parse(raw)
  return recorded((tx) => reverseMovement(tx, id, actor.id, input.reason))
}
