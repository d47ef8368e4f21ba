import { In, MoreThan, type EntityManager } from 'typeorm'
import { db } from '../db'
import { Bin, BuildLine, Part, StockLot } from '../entities'
import { badRequest, conflict } from '../errors'
import { lotOf, show } from './stock-guards'
import { buildOr404, cuttingAllowance, isBar, lineOf, shapeOf } from './builds-access'
import { planCuts, type CuttingResult } from '../../shared/domain/cutting'
import {
  BOM_EPSILON, blankLength, cutsAlongPiece, piecesDrawn, type CuttingAllowance, type PlannedDraw,
} from '../../shared/domain/bom'
import type { CuttingPlanDto } from '../../shared/types/build'

const labelOf = (line: BuildLine) => line.note || `${show(line.quantity)} mm piece`

/** The pieces and offcuts of a part (optionally in one bin), as the planner's stock. */
async function piecesInStock(tx: EntityManager, partId: number, binId?: number) {
  return tx.find(StockLot, {
    where: { partId, quantity: MoreThan(BOM_EPSILON), ...(binId ? { binId } : {}) },
    order: { quantity: 'ASC', id: 'ASC' },
  })
}

function plan(lots: StockLot[], line: BuildLine, pieces: number, c: CuttingAllowance): CuttingResult {
  return planCuts({
    stock: lots.map((l) => ({ id: String(l.id), lengthMm: l.quantity })),
    cuts: pieces > 0 ? [{ label: labelOf(line), lengthMm: line.quantity, qty: pieces }] : [],
    kerfMm: c.kerfMm,
    facingMm: c.facingMm,
  })
}

/**
 * The cuts a bar draw makes: `pieces` from the chosen stock piece, or where the cutting plan puts
 * them (offcuts before whole bars, least waste). Refuses with 409 when they do not all fit.
 */
export async function planBarDraw(
  tx: EntityManager, part: Part, line: BuildLine, pieces: number, c: CuttingAllowance, lotId?: number, binId?: number,
): Promise<PlannedDraw[]> {
  const blank = blankLength(line.quantity, c)
  if (lotId) {
    const lot = await lotOf(tx, lotId, part.id)
    if (binId && lot.binId !== binId) throw conflict('LOT_NOT_IN_BIN', 'That piece is not in the chosen bin.')
    const cuts = cutsAlongPiece(lot.id, lot.quantity, blank, c.kerfMm, pieces)
    if (!cuts) {
      throw conflict('NO_PIECE_LONG_ENOUGH',
        `That piece of ${part.code} is ${show(lot.quantity)} mm: too short for ${pieces} × ${show(line.quantity)} mm with kerf and facing. Nothing was changed.`,
        { lotId: lot.id, lengthMm: lot.quantity, pieces })
    }
    return cuts
  }
  const result = plan(await piecesInStock(tx, part.id, binId), line, pieces, c)
  if (result.unplaced.length) {
    const missing = result.unplaced.reduce((s, u) => s + u.qty, 0)
    throw conflict('NOT_ENOUGH_BAR',
      `The pieces of ${part.code} in stock cannot give ${missing} of the ${pieces} × ${show(line.quantity)} mm pieces. Nothing was changed.`,
      { unplaced: missing, pieces })
  }
  return result.plans.flatMap((p) => cutsAlongPiece(Number(p.stockId), p.stockLengthMm, blank, c.kerfMm, p.cuts.length)!)
}

/** GET the cutting plan of a bar line for the pieces not cut yet, over the pieces and offcuts in stock. */
export async function cuttingPlanFor(buildId: number, lineId: number): Promise<CuttingPlanDto> {
  const m = db().manager
  const build = await buildOr404(m, buildId)
  const line = await lineOf(m, build, lineId)
  const part = await m.findOneByOrFail(Part, { id: line.partId })
  if (!isBar(part)) throw badRequest('NOT_BAR', `${part.code} is not bar stock; only bar lines have a cutting plan.`)
  const c = await cuttingAllowance()
  const lots = await piecesInStock(m, part.id)
  const bins = new Map((await m.findBy(Bin, { id: In(lots.map((l) => l.binId)) })).map((b) => [b.id, b.code]))
  const piecesToCut = Math.max(0, line.pieces - piecesDrawn(shapeOf(line, part)))
  return {
    lineId: line.id,
    partId: part.id,
    partCode: part.code,
    partName: part.name,
    kerfMm: c.kerfMm,
    facingMm: c.facingMm,
    piecesToCut,
    lots: lots.map((l) => ({ lotId: l.id, binCode: bins.get(l.binId) ?? '', lengthMm: l.quantity })),
    result: plan(lots, line, piecesToCut, c),
  }
}
