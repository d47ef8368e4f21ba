import { In, IsNull, MoreThan, type EntityManager } from 'typeorm'
import { db } from '../db'
import { Alert, Part, Supplier, SupplierPart } from '../entities'
import { stockTotals } from './stock-totals'
import { openShortages } from './shortages'
import { onOrder } from './supply'
import { settle } from './alerts'
import { orderNeed } from '../../shared/domain/order-suggestion'
import type { SuggestionGroupDto, SuggestionLineDto } from '../../shared/types/order'

const NO_SUPPLIER = 'No supplier chosen yet'
const cents = (x: number) => Math.round(x * 100) / 100

/** The offer to order from: the preferred supplier's, else the part's only (or cheapest) offer. */
function offerFor(part: Part, offers: SupplierPart[]): SupplierPart | undefined {
  const mine = offers.filter((o) => o.partId === part.id)
  return mine.find((o) => o.supplierId === part.preferredSupplierId)
    ?? mine.sort((a, b) => a.packPrice / a.packSize - b.packPrice / b.packSize)[0]
}

/**
 * Parts at or below their reorder point, worked out afresh (the same test that opens a low-stock
 * alert, so the suggestions never wait for an alert refresh), plus open low-stock alerts.
 */
async function lowPartIds(m: EntityManager): Promise<number[]> {
  const withRop = await m.find(Part, { where: { archived: false, reorderPoint: MoreThan(0) }, select: { id: true, reorderPoint: true } })
  const totals = await stockTotals(withRop.map((p) => p.id), m)
  const alerted = await m.find(Alert, { where: { kind: 'low-stock', resolvedAt: IsNull() }, select: { partId: true } })
  return [
    ...withRop.filter((p) => (totals.get(p.id)?.available ?? 0) <= p.reorderPoint).map((p) => p.id),
    ...alerted.map((a) => a.partId!),
  ]
}

/** One line per low part or part builds are short of that needs ordering (net of open orders). */
export async function suggestionLines(partIds?: number[], m: EntityManager = db().manager) {
  const shortages = await openShortages()
  const ids = partIds ?? [...new Set([...await lowPartIds(m), ...shortages.map((s) => s.partId)])]
  if (!ids.length) return []
  const parts = await m.findBy(Part, { id: In(ids), archived: false })
  const totals = await stockTotals(ids, m)
  const due = await onOrder(ids, m)
  const offers = await m.findBy(SupplierPart, { partId: In(ids) })
  const lines: (SuggestionLineDto & { supplierId: number | null })[] = []
  for (const part of parts) {
    const t = totals.get(part.id)!
    const shortage = shortages.filter((s) => s.partId === part.id).reduce((a, s) => a + s.shortQuantity, 0)
    const offer = offerFor(part, offers)
    const packSize = offer?.packSize ?? 1
    const need = orderNeed({ ...t, onOrder: due.get(part.id) ?? 0, shortage, reorderPoint: part.reorderPoint, reorderQuantity: part.reorderQuantity, packSize })
    if (!need) continue
    const packPrice = offer?.packPrice ?? part.unitCost * packSize
    const reasons: SuggestionLineDto['reasons'] = []
    if (part.reorderPoint > 0 && t.available <= part.reorderPoint) reasons.push('low-stock')
    if (shortage > 0) reasons.push('shortage')
    lines.push({
      supplierId: offer?.supplierId ?? part.preferredSupplierId ?? null,
      partId: part.id, partCode: part.code, partName: part.name, kind: part.kind, unit: part.unit,
      ...t, onOrder: due.get(part.id) ?? 0, shortage, reorderPoint: part.reorderPoint, reorderQuantity: part.reorderQuantity,
      supplierCode: offer?.supplierCode ?? '', packSize, packPrice, packs: need.packs, quantity: need.quantity,
      lineCost: cents(need.packs * packPrice), reasons, explanation: need.explanation,
    })
  }
  return lines.sort((a, b) => a.partCode.localeCompare(b.partCode))
}

/** Suggestions grouped by supplier, the group without a supplier last (after pending alert refreshes). */
export async function orderSuggestions(m: EntityManager = db().manager): Promise<SuggestionGroupDto[]> {
  await settle()
  const lines = await suggestionLines(undefined, m)
  const supplierIds = [...new Set(lines.map((l) => l.supplierId).filter((x): x is number => x !== null))]
  const suppliers = new Map((await m.findBy(Supplier, { id: In(supplierIds) })).map((s) => [s.id, s]))
  const groups = new Map<number | null, SuggestionGroupDto>()
  for (const { supplierId, ...line } of lines) {
    const s = supplierId === null ? undefined : suppliers.get(supplierId)
    const key = s ? s.id : null
    const g = groups.get(key) ?? {
      supplierId: key, supplierName: s?.name ?? NO_SUPPLIER, supplierEmail: s?.email ?? '',
      leadTimeDays: s?.leadTimeDays ?? 0, lines: [], total: 0,
    }
    g.lines.push(line)
    g.total = cents(g.total + line.lineCost)
    groups.set(key, g)
  }
  return [...groups.values()].sort((a, b) =>
    (a.supplierId === null ? 1 : 0) - (b.supplierId === null ? 1 : 0) || a.supplierName.localeCompare(b.supplierName))
}
