import { In, MoreThan } from 'typeorm'
import { db } from '../db'
import { Build, BuildLine, Part, Reservation, StockLot } from '../entities'
import { QUANTITY_EPSILON } from './ledger'
import { cuttingAllowance, shapeOf } from './builds-access'
import { BOM_EPSILON, drawnStock, lineNeed, piecesDrawn } from '../../shared/domain/bom'
import { roleAtLeast } from '../../shared/types/api'
import type { DrawLineDto } from '../../shared/types/bin-page'

/** Builds whose lines can still be drawn. */
const OPEN_STATUSES = ['planned', 'active'] as const

/**
 * The open build lines that need a part held in bin `binId`: the user's own builds (a
 * storekeeper sees every open build, own first), reserved lines first.
 */
export async function drawLinesForBin(binId: number, user: Express.User): Promise<DrawLineDto[]> {
  const m = db().manager
  const lots = await m.findBy(StockLot, { binId, quantity: MoreThan(QUANTITY_EPSILON) })
  const partIds = [...new Set(lots.map((l) => l.partId))]
  if (!partIds.length) return []
  const everyone = roleAtLeast(user.role, 'storekeeper')
  const builds = await m.findBy(Build, { status: In([...OPEN_STATUSES]), ...(everyone ? {} : { ownerId: user.id }) })
  if (!builds.length) return []
  const lines = await m.findBy(BuildLine, { buildId: In(builds.map((b) => b.id)), partId: In(partIds) })
  if (!lines.length) return []
  const [parts, held, allowance] = await Promise.all([
    m.findBy(Part, { id: In(partIds) }),
    m.findBy(Reservation, { buildLineId: In(lines.map((l) => l.id)) }),
    cuttingAllowance(),
  ])
  const rows = lines.map((line): DrawLineDto => {
    const build = builds.find((b) => b.id === line.buildId)!
    const part = parts.find((p) => p.id === line.partId)!
    const shape = shapeOf(line, part)
    const open = shape.bar ? line.pieces - piecesDrawn(shape) : lineNeed(shape, allowance) - drawnStock(shape, allowance)
    return {
      buildId: build.id, buildName: build.name, buildStatus: build.status, mine: build.ownerId === user.id,
      lineId: line.id, partId: part.id, note: line.note, unit: shape.bar ? 'pieces' : part.unit, bar: shape.bar,
      open: Math.max(0, open), reserved: held.find((r) => r.buildLineId === line.id)?.quantity ?? 0,
    }
  })
  return rows
    .filter((r) => r.open > BOM_EPSILON)
    .sort((a, b) => Number(b.mine) - Number(a.mine) || Number(b.reserved > 0) - Number(a.reserved > 0) || a.buildName.localeCompare(b.buildName))
}
