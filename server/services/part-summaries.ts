import { In, type EntityManager } from 'typeorm'
import { Bin, Movement, StockLot, type Part } from '../entities'
import { db } from '../db'
import { stockTotals } from './stock-totals'
import { isExpired, todayIso } from './stock-guards'
import type { LotDto, PartDetailDto, PartSummaryDto } from '../../shared/types/part'

/** A compound whose safety data sheet names hazards (thread-lockers, retaining compounds). */
export const isHazardous = (p: Pick<Part, 'kind' | 'attributes'>) =>
  p.kind === 'compound' && p.attributes.hazardous === true

/**
 * List rows for parts, with on hand / reserved / available from two grouped queries for the
 * whole list (no query per part). Other features reuse this for their own part lists.
 */
export async function toPartSummaries(parts: Part[], tx?: EntityManager): Promise<PartSummaryDto[]> {
  const totals = await stockTotals(parts.map((p) => p.id), tx)
  return parts.map((p) => {
    const t = totals.get(p.id) ?? { onHand: 0, reserved: 0, available: 0 }
    return {
      id: p.id, code: p.code, name: p.name, kind: p.kind, form: p.form, threadKey: p.threadKey,
      material: p.material, sizeMm: p.sizeMm, lengthMm: p.lengthMm, unit: p.unit,
      onHand: t.onHand, reserved: t.reserved, available: t.available,
      reorderPoint: p.reorderPoint, pressureBearing: p.pressureBearing, hazardous: isHazardous(p),
      archived: p.archived, labelCode: p.labelCode,
    }
  })
}

/** The lots of a part with their bin codes: counted stock per bin, each bar piece, each batch. */
export async function lotsOf(partId: number, tx?: EntityManager): Promise<LotDto[]> {
  const m = tx ?? db().manager
  const lots = await m.find(StockLot, { where: { partId }, order: { binId: 'ASC', expiresOn: 'ASC', id: 'ASC' } })
  const held = lots.filter((l) => l.quantity > 0)
  const bins = await m.find(Bin, { where: { id: In([...new Set(held.map((l) => l.binId))]) } })
  const code = new Map(bins.map((b) => [b.id, b.code]))
  const now = todayIso()
  return held
    .map((l) => ({
      id: l.id, binId: l.binId, binCode: code.get(l.binId) ?? `#${l.binId}`, quantity: l.quantity,
      batchCode: l.batchCode, expiresOn: l.expiresOn, expired: isExpired(l.expiresOn, now),
    }))
    .sort((a, b) => a.binCode.localeCompare(b.binCode) || (a.expiresOn ?? '').localeCompare(b.expiresOn ?? ''))
}

export async function toPartDetail(part: Part, tx?: EntityManager): Promise<PartDetailDto> {
  const m = tx ?? db().manager
  const [summary] = await toPartSummaries([part], tx)
  return {
    ...summary,
    attributes: part.attributes,
    notes: part.notes,
    tags: part.tags,
    reorderQuantity: part.reorderQuantity,
    preferredSupplierId: part.preferredSupplierId,
    unitCost: part.unitCost,
    lots: await lotsOf(part.id, tx),
    hasMovements: await m.existsBy(Movement, { partId: part.id }),
  }
}
