import { In, type EntityManager } from 'typeorm'
import { Build, BuildLine, Part, Reservation, User } from '../entities'
import { stockTotals } from './stock-totals'
import { canEditBuild, cuttingAllowance, isBar, shapeOf, type Actor } from './builds-access'
import {
  availabilityOf, drawnStock, lineNeed, outstandingOf, piecesDrawn, progressOf, stockPerPiece,
  type CuttingAllowance,
} from '../../shared/domain/bom'
import type { BuildDetailDto, BuildLineDto, BuildSummaryDto } from '../../shared/types/build'

const byId = <T extends { id: number }>(rows: T[]) => new Map(rows.map((r) => [r.id, r]))
const round = (n: number) => Math.round(n * 1000) / 1000

/** The lines' DTOs with stock figures, in three grouped queries (no N+1). */
export async function toLineDtos(m: EntityManager, lines: BuildLine[], c: CuttingAllowance): Promise<BuildLineDto[]> {
  if (!lines.length) return []
  const parts = byId(await m.findBy(Part, { id: In(lines.map((l) => l.partId)) }))
  const held = new Map((await m.findBy(Reservation, { buildLineId: In(lines.map((l) => l.id)) }))
    .map((r) => [r.buildLineId, r.quantity]))
  const totals = await stockTotals(lines.map((l) => l.partId), m)
  return lines.map((line): BuildLineDto => {
    const part = parts.get(line.partId)!
    const shape = shapeOf(line, part)
    const bar = isBar(part)
    const reserved = held.get(line.id) ?? 0
    const outstanding = outstandingOf(shape, reserved, c)
    const t = totals.get(line.partId)!
    return {
      id: line.id,
      buildId: line.buildId,
      partId: part.id,
      partCode: part.code,
      partName: part.name,
      kind: part.kind,
      unit: part.unit,
      pressureBearing: part.pressureBearing,
      hazardous: part.attributes?.hazardous === true,
      quantity: line.quantity,
      pieces: line.pieces,
      bar,
      need: round(lineNeed(shape, c)),
      stockPerPiece: bar ? round(stockPerPiece(line.quantity, c)) : null,
      piecesDrawn: bar ? piecesDrawn(shape) : null,
      note: line.note,
      drawn: round(drawnStock(shape, c)),
      reserved: round(reserved),
      shortQuantity: round(line.shortQuantity),
      outstanding: round(outstanding),
      onHand: round(t.onHand),
      available: round(t.available),
      availability: availabilityOf(outstanding, t.available),
      position: line.position,
    }
  })
}

export const orderedLines = (m: EntityManager, buildIds: number[]) =>
  m.find(BuildLine, { where: { buildId: In(buildIds) }, order: { position: 'ASC', id: 'ASC' } })

/** Summaries with progress for a page of builds. */
export async function toSummaries(m: EntityManager, builds: Build[]): Promise<BuildSummaryDto[]> {
  if (!builds.length) return []
  const c = await cuttingAllowance()
  const lines = await toLineDtos(m, await orderedLines(m, builds.map((b) => b.id)), c)
  const owners = byId(await m.findBy(User, { id: In(builds.map((b) => b.ownerId)) }))
  return builds.map((b) => summaryOf(b, owners.get(b.ownerId), lines.filter((l) => l.buildId === b.id)))
}

function summaryOf(b: Build, owner: User | undefined, lines: BuildLineDto[]): BuildSummaryDto {
  return {
    id: b.id,
    name: b.name,
    status: b.status,
    ownerId: b.ownerId,
    ownerName: owner?.displayName ?? '',
    targetDate: b.targetDate,
    progress: progressOf(lines),
    updatedAt: b.updatedAt.toISOString(),
  }
}

export async function toDetail(m: EntityManager, build: Build, actor: Actor): Promise<BuildDetailDto> {
  const c = await cuttingAllowance()
  const lines = await toLineDtos(m, await orderedLines(m, [build.id]), c)
  const owner = await m.findOneBy(User, { id: build.ownerId })
  return {
    ...summaryOf(build, owner ?? undefined, lines),
    description: build.description,
    lines,
    canEdit: canEditBuild(build, actor),
    cutting: c,
  }
}
