import { IsNull, type EntityManager } from 'typeorm'
import { Movement, StockLot } from '../entities'
import { conflict } from '../errors'
import { touchPart } from '../db'
import type { MovementKind } from '../../shared/types/domain'

/** Quantities are floats (bar lengths in mm); differences below this are rounding, not stock. */
export const QUANTITY_EPSILON = 1e-6

export interface MovementInput {
  kind: MovementKind
  partId: number
  quantity: number
  fromLotId?: number | null
  toLotId?: number | null
  buildId?: number | null
  purchaseOrderId?: number | null
  userId: number
  reason?: string
  reversesId?: number | null
}

/**
 * Writes one ledger row and applies it to the lots, inside the caller's transaction.
 * The decrement is a conditional UPDATE, so a lot can never go below zero even if two
 * requests raced past an earlier check; the caller's transaction then rolls back whole.
 */
export async function postMovement(tx: EntityManager, input: MovementInput): Promise<Movement> {
  if (!(input.quantity > 0)) throw new Error(`Movement quantity must be positive, got ${input.quantity}`)
  touchPart(tx, input.partId)
  const lots = tx.getRepository(StockLot)
  let fromBinId: number | null = null
  let toBinId: number | null = null
  if (input.fromLotId) {
    const result = await tx.createQueryBuilder().update(StockLot)
      .set({ quantity: () => 'quantity - :q' })
      .where('id = :id AND quantity >= :least', { id: input.fromLotId, least: input.quantity - QUANTITY_EPSILON })
      .setParameter('q', input.quantity)
      .execute()
    const lot = await lots.findOneByOrFail({ id: input.fromLotId })
    if (result.affected !== 1) {
      throw conflict('INSUFFICIENT_STOCK',
        `Only ${round(lot.quantity)} left in that bin; ${round(input.quantity)} was asked for. Nothing was changed.`,
        { lotId: lot.id, onHand: lot.quantity, requested: input.quantity })
    }
    fromBinId = lot.binId
  }
  if (input.toLotId) {
    await tx.increment(StockLot, { id: input.toLotId }, 'quantity', input.quantity)
    toBinId = (await lots.findOneByOrFail({ id: input.toLotId })).binId
  }
  return tx.getRepository(Movement).save({
    kind: input.kind,
    partId: input.partId,
    quantity: input.quantity,
    fromLotId: input.fromLotId ?? null,
    toLotId: input.toLotId ?? null,
    fromBinId,
    toBinId,
    buildId: input.buildId ?? null,
    purchaseOrderId: input.purchaseOrderId ?? null,
    userId: input.userId,
    reason: input.reason ?? '',
    reversesId: input.reversesId ?? null,
  })
}

/** The bin's single lot of a counted part, made empty if the bin has none yet. */
export async function countLotFor(tx: EntityManager, partId: number, binId: number): Promise<StockLot> {
  const lots = tx.getRepository(StockLot)
  const existing = await lots.findOneBy({ partId, binId, batchCode: IsNull() })
  return existing ?? lots.save({ partId, binId, quantity: 0, batchCode: null, expiresOn: null })
}

const round = (n: number) => Math.round(n * 1000) / 1000
