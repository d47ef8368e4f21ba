import type { EntityManager } from 'typeorm'
import { inTransaction, touchPart } from '../db'
import { BuildLine, Movement, Part, Reservation, StockLot, type Build } from '../entities'
import { badRequest, conflict } from '../errors'
import { stockTotalsOf } from './stock-totals'
import { drawFromLots } from './stock-draw'
import { returnToBin } from './stock-moves'
import { show } from './stock-guards'
import { assertOpen, cuttingAllowance, editableBuild, isBar, lineOf, shapeOf, type Actor } from './builds-access'
import { settleLine } from './builds-lines'
import { planBarDraw } from './builds-cutting'
import { toDetail } from './builds-view'
import {
  BOM_EPSILON, blankLength, drawnStock, lineNeed, piecesDrawn, stockPerPiece, type CuttingAllowance,
} from '../../shared/domain/bom'
import { drawInput, returnInput, type DrawInput, type ReturnInput } from '../../shared/schemas/build'
import type { BuildDetailDto } from '../../shared/types/build'

export interface DrawResult {
  movements: number[]
  build: BuildDetailDto
}

/**
 * What a draw takes beyond the line's own reservation must come from free stock (on hand −
 * every reservation), so one build's draw never eats another build's holding.
 */
async function assertFreeFor(tx: EntityManager, part: Part, extra: number) {
  if (extra <= BOM_EPSILON) return
  const { available } = await stockTotalsOf(part.id, tx)
  if (available + BOM_EPSILON < extra) {
    throw conflict('INSUFFICIENT_STOCK',
      `${part.code}: ${show(extra)} ${part.unit} more than this line holds is needed, but only ${show(Math.max(0, available))} is free. Nothing was changed.`,
      { requested: extra, available: Math.max(0, available) })
  }
}

/** Takes `amount` off the line's reservation (deleting it at zero); returns what it held before. */
async function useReservation(tx: EntityManager, line: BuildLine, amount: number) {
  const held = await tx.findOneBy(Reservation, { buildLineId: line.id })
  if (!held) return 0
  const left = held.quantity - amount
  if (left <= BOM_EPSILON) await tx.delete(Reservation, { id: held.id })
  else await tx.update(Reservation, { id: held.id }, { quantity: left })
  return held.quantity
}

async function drawCounted(tx: EntityManager, build: Build, line: BuildLine, part: Part, input: ReturnType<typeof drawInput.parse>, actor: Actor, c: CuttingAllowance) {
  const open = lineNeed(shapeOf(line, part), c) - drawnStock(shapeOf(line, part), c)
  const quantity = input.quantity ?? open
  if (quantity <= BOM_EPSILON) throw conflict('LINE_DRAWN', `${part.code} is already drawn in full for this line.`)
  if (quantity > open + BOM_EPSILON) {
    throw conflict('OVER_DRAW', `${part.code}: the line needs ${show(open)} ${part.unit} more; ${show(quantity)} was asked for. Raise the line's quantity first.`,
      { open, requested: quantity })
  }
  const held = (await tx.findOneBy(Reservation, { buildLineId: line.id }))?.quantity ?? 0
  await assertFreeFor(tx, part, quantity - held)
  const moves = await drawFromLots(tx, {
    partId: part.id, quantity, binId: input.binId, lotId: input.lotId, buildId: build.id, userId: actor.id,
    reason: input.reason || `${build.name}: ${line.note || part.name}`, role: actor.role,
  })
  await useReservation(tx, line, quantity)
  line.drawn += quantity
  return moves
}

/** Bar lines: each piece a cut of its blank (length + facing) plus kerf, from the chosen piece or as planned. */
async function drawBar(tx: EntityManager, build: Build, line: BuildLine, part: Part, input: ReturnType<typeof drawInput.parse>, actor: Actor, c: CuttingAllowance) {
  if (input.quantity !== undefined) {
    throw badRequest('BAR_LINE_PIECES', 'A bar line is drawn in pieces: give pieces (and the stock piece, or let the cutting plan choose).')
  }
  const left = line.pieces - piecesDrawn(shapeOf(line, part))
  const pieces = input.pieces ?? left
  if (left <= 0) throw conflict('LINE_DRAWN', `All ${line.pieces} piece(s) of this line are already cut.`)
  if (pieces > left) throw conflict('OVER_DRAW', `Only ${left} piece(s) of this line are still to cut; ${pieces} was asked for.`, { open: left, requested: pieces })
  const cuts = await planBarDraw(tx, part, line, pieces, c, input.lotId, input.binId)
  const held = (await tx.findOneBy(Reservation, { buildLineId: line.id }))?.quantity ?? 0
  await assertFreeFor(tx, part, cuts.reduce((s, cut) => s + cut.takeMm, 0) - held)
  const moves: Movement[] = []
  for (const cut of cuts) {
    moves.push(...await drawFromLots(tx, {
      partId: part.id, quantity: blankLength(line.quantity, c), lotId: cut.lotId, buildId: build.id, userId: actor.id,
      kerfMm: c.kerfMm, role: actor.role,
      reason: input.reason || `${build.name}: ${line.note || 'piece'} ${show(line.quantity)} mm (cut ${cut.startMm}–${cut.endMm} mm of the piece)`,
    }))
  }
  await useReservation(tx, line, pieces * stockPerPiece(line.quantity, c))
  line.drawn += pieces * line.quantity
  return moves
}

/** Draws for one line: ledger rows linked to the build; the line's reservation shrinks by what was drawn. */
export const drawForBuild = (buildId: number, raw: DrawInput, actor: Actor): Promise<DrawResult> =>
  inTransaction(async (tx) => {
    const input = drawInput.parse(raw)
    const build = await editableBuild(tx, buildId, actor)
    assertOpen(build)
    const line = await lineOf(tx, build, input.lineId)
    const part = await tx.findOneByOrFail(Part, { id: line.partId })
    const c = await cuttingAllowance()
    const moves = isBar(part)
      ? await drawBar(tx, build, line, part, input, actor, c)
      : await drawCounted(tx, build, line, part, input, actor, c)
    await settleLine(tx, line, part, c)
    touchPart(tx, part.id)
    return { movements: moves.map((m) => m.id), build: await toDetail(tx, build, actor) }
  })

/**
 * Puts unused parts back in a bin (ledger 'return' linked to the build). Counted and batch lines
 * count them off what was drawn; a bar return is an offcut, a new piece, and the cut pieces stay drawn.
 */
export const returnFromBuild = (buildId: number, raw: ReturnInput, actor: Actor): Promise<DrawResult> =>
  inTransaction(async (tx) => {
    const input = returnInput.parse(raw)
    const build = await editableBuild(tx, buildId, actor)
    const line = await lineOf(tx, build, input.lineId)
    const part = await tx.findOneByOrFail(Part, { id: line.partId })
    const c = await cuttingAllowance()
    const drawn = drawnStock(shapeOf(line, part), c)
    if (input.quantity > drawn + BOM_EPSILON) {
      throw conflict('RETURN_MORE_THAN_DRAWN',
        `Only ${show(drawn)} ${part.unit} of ${part.code} was drawn for this line; ${show(input.quantity)} cannot come back.`,
        { drawn, requested: input.quantity })
    }
    const batch = isBar(part) ? undefined : await lastBatchDrawn(tx, build.id, part)
    const move = await returnToBin(tx, {
      partId: part.id, binId: input.binId, quantity: input.quantity, buildId: build.id, userId: actor.id,
      reason: input.reason || `${build.name}: unused ${line.note || part.name}`, ...batch,
    })
    if (!isBar(part)) line.drawn = Math.max(0, line.drawn - input.quantity)
    await tx.save(line)
    return { movements: [move.id], build: await toDetail(tx, build, actor) }
  })

/** Batches return into the batch they were last drawn from for this build. */
async function lastBatchDrawn(tx: EntityManager, buildId: number, part: Part) {
  if (part.kind !== 'compound') return undefined
  const last = await tx.findOne(Movement, { where: { buildId, partId: part.id, kind: 'draw' }, order: { id: 'DESC' } })
  const lot = last?.fromLotId ? await tx.findOneBy(StockLot, { id: last.fromLotId }) : null
  return lot ? { batchCode: lot.batchCode ?? undefined, expiresOn: lot.expiresOn ?? undefined } : undefined
}
