import { In, type EntityManager } from 'typeorm'
import { db, inTransaction, touchPart } from '../db'
import { BuildLine, Part, Reservation, type Build } from '../entities'
import { conflict } from '../errors'
import { lockParts, stockTotalsOf } from './stock-totals'
import { show } from './stock-guards'
import { assertOpen, cuttingAllowance, editableBuild, isBar, lineOf, shapeOf, type Actor } from './builds-access'
import { toDetail } from './builds-view'
import { BOM_EPSILON, outstandingOf, type CuttingAllowance } from '../../shared/domain/bom'
import { releaseInput, reserveInput, type ReleaseInput, type ReserveInput } from '../../shared/schemas/build'
import type { BuildDetailDto, ReserveResultDto } from '../../shared/types/build'

/** Stands in for the cutting allowance where no line is cut from bar (counted lines never use it). */
const NOT_CUT: CuttingAllowance = { kerfMm: 0, facingMm: 0 }

export interface Grant {
  lineId: number
  partCode: string
  unit: string
  requested: number
  granted: number
  available: number
  shortQuantity: number
}

/**
 * Holds stock for one line inside the caller's transaction. Availability is read in the same
 * transaction, and every stock-changing transaction runs one at a time (inTransaction), so two
 * requests can never both see the same free stock.
 */
async function reserveLine(
  tx: EntityManager, line: BuildLine, part: Part, c: CuttingAllowance,
  wanted: number | undefined, allowPartial: boolean, userId: number,
): Promise<Grant> {
  const held = await tx.findOneBy(Reservation, { buildLineId: line.id })
  const outstanding = outstandingOf(shapeOf(line, part), held?.quantity ?? 0, c)
  if (wanted !== undefined && wanted > outstanding + BOM_EPSILON) {
    throw conflict('OVER_NEED',
      `${part.code}: the line needs only ${show(outstanding)} ${part.unit} more; ${show(wanted)} was asked for. Nothing was changed.`,
      { lineId: line.id, outstanding, requested: wanted })
  }
  const want = wanted ?? outstanding
  const { available } = await stockTotalsOf(part.id, tx)
  const free = Math.max(0, available)
  // Counted parts are held in whole items even if a bar-like float slipped into the totals.
  const granted = want <= free + BOM_EPSILON ? want : (isBar(part) || part.kind === 'compound' ? free : Math.floor(free))
  const grant: Grant = { lineId: line.id, partCode: part.code, unit: part.unit, requested: want, granted, available, shortQuantity: 0 }
  if (granted + BOM_EPSILON < want && !allowPartial) return grant
  if (granted > BOM_EPSILON) {
    if (held) await tx.increment(Reservation, { id: held.id }, 'quantity', granted)
    else {
      // updateEntity(false): no read-back of the new row's id and createdAt, which nothing here uses.
      await tx.createQueryBuilder().insert().into(Reservation).updateEntity(false)
        .values({ partId: part.id, buildId: line.buildId, buildLineId: line.id, quantity: granted, userId }).execute()
    }
    touchPart(tx, part.id)
  }
  const stillOpen = Math.max(0, outstanding - granted)
  let short = allowPartial && granted + BOM_EPSILON < want ? want - granted : Math.min(line.shortQuantity, stillOpen)
  if (short < BOM_EPSILON) short = 0
  // Most reservations leave the recorded shortage as it was (none): no write then.
  if (short !== line.shortQuantity) {
    line.shortQuantity = short
    await tx.update(BuildLine, { id: line.id }, { shortQuantity: short })
  }
  touchPart(tx, part.id)
  grant.shortQuantity = line.shortQuantity
  return grant
}

function insufficient(build: Build, short: Grant[]) {
  const list = short.map((g) =>
    `${g.partCode} needs ${show(g.requested)} ${g.unit}, ${show(Math.max(0, g.available))} free (${show(g.requested - g.granted)} short)`)
  return conflict('INSUFFICIENT_STOCK',
    `Not enough free stock for ${build.name}: ${list.join('; ')}. Nothing was reserved; reserve what there is to record the shortage.`,
    { lines: short.map((g) => ({ lineId: g.lineId, partCode: g.partCode, requested: g.requested, available: Math.max(0, g.available), shortfall: g.requested - g.granted })) })
}

/**
 * Reserves one line (lineId) or every line of the build, in one transaction. Without
 * allowPartial any shortfall refuses the whole request with 409 naming each shortfall and
 * changes nothing; with it, what there is is held and the rest recorded as the line's shortage.
 */
export async function reserve(buildId: number, raw: ReserveInput, actor: Actor): Promise<ReserveResultDto> {
  const { build, grants } = await inTransaction(async (tx) => {
    const input = reserveInput.parse(raw)
    const build = await editableBuild(tx, buildId, actor)
    return { build, grants: await reserveIn(tx, build, input, actor.id) }
  })
  return {
    lines: grants.map((g) => ({ lineId: g.lineId, partCode: g.partCode, requested: g.requested, granted: g.granted, shortQuantity: g.shortQuantity })),
    // Read after the commit, outside the write queue: the next writer need not wait for it.
    build: await toDetail(db().manager, build, actor),
  }
}

/** The reservation itself, inside the caller's transaction (the demo seed uses it too). */
export async function reserveIn(tx: EntityManager, build: Build, raw: ReserveInput, userId: number): Promise<Grant[]> {
  const input = reserveInput.parse(raw)
  assertOpen(build)
  const lines = input.lineId
    ? [await lineOf(tx, build, input.lineId)]
    : await tx.find(BuildLine, { where: { buildId: build.id }, order: { position: 'ASC', id: 'ASC' } })
  const partIds = lines.map((l) => l.partId)
  // All of the build's parts at once, in id order, before any line takes its own lock.
  await lockParts(tx, partIds)
  const parts = new Map((await tx.findBy(Part, { id: In(partIds) })).map((p) => [p.id, p]))
  // Kerf and facing only size bar lines: a request for counted parts skips the settings read.
  const c = lines.some((l) => isBar(parts.get(l.partId)!)) ? await cuttingAllowance() : NOT_CUT
  const grants: Grant[] = []
  for (const line of lines) {
    grants.push(await reserveLine(tx, line, parts.get(line.partId)!, c, input.quantity, input.allowPartial, userId))
  }
  const short = grants.filter((g) => g.granted + BOM_EPSILON < g.requested)
  // Throwing rolls the transaction back: the lines already held in this request are undone too.
  if (short.length && !input.allowPartial) throw insufficient(build, short)
  return grants
}

/** Lets go of one line's reservation or all of the build's; their recorded shortages go too. */
export const release = (buildId: number, raw: ReleaseInput, actor: Actor): Promise<BuildDetailDto> =>
  inTransaction(async (tx) => {
    const input = releaseInput.parse(raw)
    const build = await editableBuild(tx, buildId, actor)
    const lines = input.lineId
      ? [await lineOf(tx, build, input.lineId)]
      : await tx.findBy(BuildLine, { buildId: build.id })
    await releaseLines(tx, lines)
    return toDetail(tx, build, actor)
  })

export async function releaseLines(tx: EntityManager, lines: BuildLine[]) {
  if (!lines.length) return
  await tx.delete(Reservation, { buildLineId: In(lines.map((l) => l.id)) })
  await tx.update(BuildLine, { id: In(lines.map((l) => l.id)) }, { shortQuantity: 0 })
  for (const l of lines) touchPart(tx, l.partId)
}
