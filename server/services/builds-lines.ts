import { In, type EntityManager } from 'typeorm'
import { inTransaction, touchPart } from '../db'
import { BuildLine, Part, Reservation, type Build } from '../entities'
import { badRequest, conflict } from '../errors'
import { activePart } from './stock-guards'
import { buildOr404, cuttingAllowance, editableBuild, isBar, lineOf, shapeOf, type Actor } from './builds-access'
import { toDetail } from './builds-view'
import { BOM_EPSILON, drawnStock, lineNeed, type CuttingAllowance } from '../../shared/domain/bom'
import { MAX_MM } from '../../shared/schemas/part'
import {
  copyLinesInput, lineInput, linePatch,
  type CopyLinesInput, type LineInput, type LinePatch,
} from '../../shared/schemas/build'
import type { BuildDetailDto, CopyLinesResultDto } from '../../shared/types/build'

/** Why a quantity does not suit the part, or null: whole items, pieces for bar only, bar ≤ MAX_MM. */
export function lineProblem(part: Part, quantity: number, pieces: number): string | null {
  if (isBar(part)) {
    return quantity > MAX_MM ? `${part.code} is bar stock: the quantity is each piece's length, at most ${MAX_MM} mm` : null
  }
  if (pieces !== 1) return `${part.code} is not bar stock: pieces apply to bar, tube and sheet only`
  if (part.kind !== 'compound' && !Number.isInteger(quantity)) return `${part.code} is counted in whole items`
  return null
}

function assertLineFits(part: Part, quantity: number, pieces: number) {
  const problem = lineProblem(part, quantity, pieces)
  if (problem) throw badRequest('BAD_LINE_QUANTITY', `${problem[0].toUpperCase()}${problem.slice(1)}.`)
}

async function nextPosition(tx: EntityManager, buildId: number) {
  const row = await tx.createQueryBuilder(BuildLine, 'l').select('MAX(l.position)', 'max')
    .where('l.buildId = :buildId', { buildId }).getRawOne<{ max: number | null }>()
  return row?.max === null || row?.max === undefined ? 0 : Number(row.max) + 1
}

export async function addLineTo(tx: EntityManager, build: Build, raw: LineInput): Promise<BuildLine> {
  const input = lineInput.parse(raw)
  const part = await activePart(tx, input.partId)
  assertLineFits(part, input.quantity, input.pieces)
  return tx.save(BuildLine, tx.create(BuildLine, {
    buildId: build.id, partId: part.id, quantity: input.quantity, pieces: input.pieces, note: input.note,
    drawn: 0, shortQuantity: 0, position: await nextPosition(tx, build.id),
  }))
}

export const addLine = (buildId: number, raw: LineInput, actor: Actor): Promise<BuildDetailDto> =>
  inTransaction(async (tx) => {
    const build = await editableBuild(tx, buildId, actor)
    await addLineTo(tx, build, raw)
    return toDetail(tx, build, actor)
  })

/**
 * Keeps a line's reservation and recorded shortage within what it still needs after an edit:
 * a reservation above need − drawn is released, a shortage above what is not held is cut.
 */
export async function settleLine(tx: EntityManager, line: BuildLine, part: Part, c: CuttingAllowance) {
  const shape = shapeOf(line, part)
  const open = Math.max(0, lineNeed(shape, c) - drawnStock(shape, c))
  const held = await tx.findOneBy(Reservation, { buildLineId: line.id })
  let holding = held?.quantity ?? 0
  if (held && held.quantity > open + BOM_EPSILON) {
    holding = open
    if (open <= BOM_EPSILON) await tx.delete(Reservation, { id: held.id })
    else await tx.update(Reservation, { id: held.id }, { quantity: open })
    touchPart(tx, part.id)
  }
  const notHeld = Math.max(0, open - holding)
  if (line.shortQuantity > notHeld + BOM_EPSILON) {
    line.shortQuantity = notHeld
    touchPart(tx, part.id)
  }
  await tx.save(line)
}

export const updateLine = (buildId: number, lineId: number, raw: LinePatch, actor: Actor): Promise<BuildDetailDto> =>
  inTransaction(async (tx) => {
    const input = linePatch.parse(raw)
    const build = await editableBuild(tx, buildId, actor)
    const line = await lineOf(tx, build, lineId)
    const part = await tx.findOneByOrFail(Part, { id: line.partId })
    const quantity = input.quantity ?? line.quantity
    const pieces = input.pieces ?? line.pieces
    assertLineFits(part, quantity, pieces)
    const c = await cuttingAllowance()
    const before = drawnStock(shapeOf(line, part), c)
    const needAfter = lineNeed({ ...shapeOf(line, part), quantity, pieces }, c)
    const piecesCut = isBar(part) ? Math.round(line.drawn / line.quantity) : 0
    if (needAfter + BOM_EPSILON < before || (isBar(part) && pieces < piecesCut)) {
      throw conflict('BELOW_DRAWN', `More than that has already been drawn for this line; return parts first.`,
        { drawn: before, requested: needAfter })
    }
    if (isBar(part) && quantity !== line.quantity && piecesCut > 0) {
      throw conflict('PIECES_ALREADY_CUT', 'Pieces of this length are already cut; add a new line for another length.')
    }
    Object.assign(line, { quantity, pieces, note: input.note ?? line.note, position: input.position ?? line.position })
    await settleLine(tx, line, part, c)
    return toDetail(tx, build, actor)
  })

/** Removes a line and its reservation; a line with parts drawn stays (return them first). */
export const deleteLine = (buildId: number, lineId: number, actor: Actor): Promise<BuildDetailDto> =>
  inTransaction(async (tx) => {
    const build = await editableBuild(tx, buildId, actor)
    const line = await lineOf(tx, build, lineId)
    if (line.drawn > BOM_EPSILON) {
      throw conflict('LINE_DRAWN', 'Parts have been drawn for this line; return them before removing it.')
    }
    await tx.delete(Reservation, { buildLineId: line.id })
    await tx.delete(BuildLine, { id: line.id })
    touchPart(tx, line.partId)
    return toDetail(tx, build, actor)
  })

/** Copies lines (part, quantity, pieces, note) from another build; archived parts are skipped and named. */
export const copyLines = (buildId: number, raw: CopyLinesInput, actor: Actor): Promise<CopyLinesResultDto> =>
  inTransaction(async (tx) => {
    const input = copyLinesInput.parse(raw)
    const build = await editableBuild(tx, buildId, actor)
    if (input.fromBuildId === build.id) throw badRequest('SAME_BUILD', 'Choose another build to copy lines from.')
    const source = await buildOr404(tx, input.fromBuildId)
    const lines = await tx.find(BuildLine, {
      where: { buildId: source.id, ...(input.lineIds ? { id: In(input.lineIds) } : {}) },
      order: { position: 'ASC', id: 'ASC' },
    })
    const parts = new Map((await tx.findBy(Part, { id: In(lines.map((l) => l.partId)) })).map((p) => [p.id, p]))
    const skipped: string[] = []
    let copied = 0
    for (const l of lines) {
      const part = parts.get(l.partId)!
      if (part.archived) { skipped.push(part.code); continue }
      await addLineTo(tx, build, { partId: part.id, quantity: l.quantity, pieces: l.pieces, note: l.note })
      copied++
    }
    return { copied, skipped, build: await toDetail(tx, build, actor) }
  })
