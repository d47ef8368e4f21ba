import { In, MoreThan, type EntityManager } from 'typeorm'
import { Build, Reservation, StockLot, type Movement, type Part } from '../entities'
import { conflict } from '../errors'
import { postMovement, QUANTITY_EPSILON } from './ledger'
import { stockTotalsOf } from './stock-totals'
import { activePart, assertOverride, assertWholeItems, isExpired, lotOf, show, todayIso } from './stock-guards'
import { stockModeOf } from '../../shared/types/domain'
import type { Role } from '../../shared/types/api'

export interface DrawInput {
  partId: number
  /** Items, mm of bar (one cut from one piece), or containers of a compound. */
  quantity: number
  /** Only from this bin; otherwise from any bin holding the part. */
  binId?: number
  /** A chosen lot (bar piece or batch). */
  lotId?: number
  /**
   * A build draw. Reservations are the build service's business: a draw WITH a build is not
   * checked against reservations here; a plain take (no build) may not eat into them.
   */
  buildId?: number | null
  userId: number
  reason?: string
  /** Storekeeper override (needs a reason): draw an expired batch. */
  allowExpired?: boolean
  /** Storekeeper override (needs a reason): a plain take that eats into reserved stock. */
  allowReserved?: boolean
  /** Bar stock: saw kerf lost in the cut; recorded as an 'adjust' movement beside the draw. */
  kerfMm?: number
  /** The acting user's role; when given, overrides are refused below storekeeper (403). */
  role?: Role
}

/**
 * Takes stock out of the stores inside the caller's transaction and returns the ledger rows.
 * Counted parts come from the bin's lot (several bins, smallest lot first, when no bin is
 * given); batches first-expiry-first-out with expired ones refused; bar stock is one cut from
 * one piece, the rest staying in the same lot as the offcut. Throws 409 and writes nothing
 * (the caller's transaction rolls back) when it cannot be done in full.
 */
export async function drawFromLots(tx: EntityManager, input: DrawInput): Promise<Movement[]> {
  const part = await activePart(tx, input.partId)
  assertWholeItems(part, input.quantity)
  if (input.allowExpired) assertOverride('draw from an expired batch', input.role, input.reason)
  // The lots are checked first: "not enough in that bin" is plainer than naming the builds.
  if (stockModeOf(part.kind) === 'length') return cutFromPiece(tx, part, input)
  const lots = await candidateLots(tx, part, input)
  if (!input.buildId) await guardReservations(tx, part, input)
  const moves: Movement[] = []
  let left = input.quantity
  for (const lot of lots) {
    if (left <= QUANTITY_EPSILON) break
    const take = Math.min(left, lot.quantity)
    moves.push(await postMovement(tx, draw(input, take, lot.id)))
    left -= take
  }
  return moves
}

const draw = (input: DrawInput, quantity: number, fromLotId: number) => ({
  kind: 'draw' as const, partId: input.partId, quantity, fromLotId,
  buildId: input.buildId ?? null, userId: input.userId, reason: input.reason ?? '',
})

/** A plain take may use only what no build holds: on hand − reserved, for the part. */
async function guardReservations(tx: EntityManager, part: Part, input: DrawInput) {
  const totals = await stockTotalsOf(part.id, tx)
  if (totals.reserved <= QUANTITY_EPSILON || input.quantity <= totals.available + QUANTITY_EPSILON) return
  if (input.allowReserved) return assertOverride('take stock reserved for builds', input.role, input.reason)
  const held = await tx.createQueryBuilder(Reservation, 'r')
    .select('r.buildId', 'buildId').addSelect('SUM(r.quantity)', 'quantity')
    .where('r.partId = :id', { id: part.id }).groupBy('r.buildId').getRawMany<{ buildId: number; quantity: number }>()
  const builds = await tx.findBy(Build, { id: In(held.map((h) => h.buildId)) })
  const named = held.map((h) => ({
    buildId: Number(h.buildId), name: builds.find((b) => b.id === Number(h.buildId))?.name ?? `build ${h.buildId}`,
    quantity: Number(h.quantity),
  }))
  throw conflict('RESERVED_FOR_BUILDS',
    `Only ${show(Math.max(0, totals.available))} ${part.unit} of ${part.code} is free; the rest is held for `
    + `${named.map((b) => `${b.name} (${show(b.quantity)})`).join(', ')}. Nothing was changed.`,
    { available: totals.available, requested: input.quantity, builds: named })
}

/** The lots a counted or batch draw takes from, in order, checked to cover the quantity. */
async function candidateLots(tx: EntityManager, part: Part, input: DrawInput): Promise<StockLot[]> {
  const batch = stockModeOf(part.kind) === 'batch'
  let lots: StockLot[]
  if (input.lotId) {
    const lot = await lotOf(tx, input.lotId, part.id)
    if (input.binId && lot.binId !== input.binId) throw conflict('LOT_NOT_IN_BIN', 'That lot is not in the chosen bin.')
    lots = [lot]
  } else {
    lots = await tx.find(StockLot, {
      where: { partId: part.id, quantity: MoreThan(QUANTITY_EPSILON), ...(input.binId ? { binId: input.binId } : {}) },
      // FEFO for batches (expiry first, oldest lot on a tie); otherwise empty the smallest lot first.
      order: batch ? { expiresOn: 'ASC', id: 'ASC' } : { quantity: 'ASC', id: 'ASC' },
    })
  }
  const today = todayIso()
  const usable = batch && !input.allowExpired ? lots.filter((l) => !isExpired(l.expiresOn, today)) : lots
  const sum = (ls: StockLot[]) => ls.reduce((s, l) => s + l.quantity, 0)
  if (sum(usable) + QUANTITY_EPSILON >= input.quantity) return usable
  const expired = lots.filter((l) => isExpired(l.expiresOn, today) && l.quantity > QUANTITY_EPSILON)
  if (usable !== lots && expired.length && sum(lots) + QUANTITY_EPSILON >= input.quantity) {
    throw conflict('BATCH_EXPIRED',
      `Batch ${expired.map((l) => `${l.batchCode} (expired ${l.expiresOn})`).join(', ')} of ${part.code} is past its `
      + 'expiry date. A storekeeper may override with a reason. Nothing was changed.',
      { batches: expired.map((l) => ({ lotId: l.id, batchCode: l.batchCode, expiresOn: l.expiresOn, quantity: l.quantity })) })
  }
  const where = input.binId || input.lotId ? 'there' : 'in the stores'
  throw conflict('INSUFFICIENT_STOCK',
    `Only ${show(sum(usable))} ${part.unit} of ${part.code} ${where}; ${show(input.quantity)} was asked for. Nothing was changed.`,
    { onHand: sum(usable), requested: input.quantity })
}

/** Bar stock: one cut from the chosen piece, or the shortest piece that fits. */
async function cutFromPiece(tx: EntityManager, part: Part, input: DrawInput): Promise<Movement[]> {
  const piece = input.lotId
    ? await lotOf(tx, input.lotId, part.id)
    : await tx.findOne(StockLot, {
      where: { partId: part.id, quantity: MoreThan(input.quantity - QUANTITY_EPSILON), ...(input.binId ? { binId: input.binId } : {}) },
      order: { quantity: 'ASC', id: 'ASC' },
    })
  if (!piece || piece.quantity + QUANTITY_EPSILON < input.quantity) {
    const longest = await tx.findOne(StockLot, {
      where: { partId: part.id, ...(input.binId ? { binId: input.binId } : {}) }, order: { quantity: 'DESC' },
    })
    throw conflict('NO_PIECE_LONG_ENOUGH',
      `No piece of ${part.code} is ${show(input.quantity)} mm long${piece ? ' (that piece is ' + show(piece.quantity) + ' mm)' : ''}; `
      + `the longest ${input.binId ? 'in that bin ' : ''}is ${show(longest?.quantity ?? 0)} mm. Nothing was changed.`,
      { requested: input.quantity, longest: longest?.quantity ?? 0 })
  }
  if (input.binId && piece.binId !== input.binId) throw conflict('LOT_NOT_IN_BIN', 'That piece is not in the chosen bin.')
  if (!input.buildId) await guardReservations(tx, part, input)
  const moves = [await postMovement(tx, draw(input, input.quantity, piece.id))]
  // The kerf can only eat what is left of the piece: a cut at the very end loses less.
  const kerf = Math.min(input.kerfMm ?? 0, piece.quantity - input.quantity)
  if (kerf > QUANTITY_EPSILON) {
    moves.push(await postMovement(tx, {
      ...draw(input, kerf, piece.id), kind: 'adjust',
      reason: `Saw kerf of the ${show(input.quantity)} mm cut`,
    }))
  }
  return moves
}
