import { In, MoreThanOrEqual, type EntityManager } from 'typeorm'
import { db, inTransaction, touchPart } from '../db'
import { Movement, Part, PurchaseLine, PurchaseOrder, Supplier, SupplierPart } from '../entities'
import { notFound } from '../errors'
import { stockTotals } from './stock-totals'
import { toOfferDtos } from './suppliers'
import {
  buildReorderSuggestion, DEFAULT_HOLDING_RATE, DEFAULT_LEAD_TIME_DAYS, DEFAULT_ORDER_COST,
} from '../../shared/domain/reorder-suggestion'
import { reorderRulesInput, suggestionQuery, type ReorderRulesInput } from '../../shared/schemas/supplier'
import type { OrderStatus } from '../../shared/types/domain'
import type { PartSupplyDto, ReorderSuggestionDto } from '../../shared/types/supplier'

/** Orders whose remaining quantities are still to come (a draft counts: it is about to be sent). */
export const OPEN_ORDER_STATUSES: OrderStatus[] = ['draft', 'sent', 'part-received']
const MS_PER_DAY = 86_400_000

/** Quantity still to arrive per part on open orders. */
export async function onOrder(partIds: number[], m: EntityManager = db().manager): Promise<Map<number, number>> {
  const result = new Map<number, number>()
  if (!partIds.length) return result
  const rows: { partId: number; due: number }[] = await m.createQueryBuilder(PurchaseLine, 'l')
    .innerJoin(PurchaseOrder, 'o', 'o.id = l.orderId')
    .select('l.partId', 'partId').addSelect('SUM(CASE WHEN l.quantity > l.receivedQuantity THEN l.quantity - l.receivedQuantity ELSE 0 END)', 'due')
    .where({ partId: In([...new Set(partIds)]) }).andWhere('o.status IN (:...open)', { open: OPEN_ORDER_STATUSES })
    .groupBy('l.partId').getRawMany()
  for (const r of rows) result.set(Number(r.partId), Number(r.due))
  return result
}

async function partOrFail(m: EntityManager, id: number) {
  const part = await m.findOneBy(Part, { id })
  if (!part) throw notFound('The part')
  return part
}

export async function partSupply(partId: number, m: EntityManager = db().manager): Promise<PartSupplyDto> {
  const part = await partOrFail(m, partId)
  const totals = (await stockTotals([partId], m)).get(partId)!
  const due = (await onOrder([partId], m)).get(partId) ?? 0
  const offers = await toOfferDtos(m, await m.find(SupplierPart, { where: { partId }, order: { id: 'ASC' } }))
  offers.sort((a, b) => Number(b.preferred) - Number(a.preferred) || a.unitPrice - b.unitPrice)
  return {
    part: {
      id: part.id, code: part.code, name: part.name, kind: part.kind, unit: part.unit,
      reorderPoint: part.reorderPoint, reorderQuantity: part.reorderQuantity,
      preferredSupplierId: part.preferredSupplierId, unitCost: part.unitCost, ...totals, onOrder: due,
    },
    offers,
  }
}

/** Draws (positive) and returns (negative) of the part since `since`. */
async function usageSince(m: EntityManager, partId: number, since: Date) {
  const rows = await m.find(Movement, {
    where: { partId, kind: In(['draw', 'return']), at: MoreThanOrEqual(since) },
    select: { at: true, quantity: true, kind: true },
  })
  return rows.map((r) => ({ at: r.at, quantity: r.kind === 'draw' ? r.quantity : -r.quantity }))
}

/** The reorder suggestion from the part's own ledger; nothing is changed. */
export async function reorderSuggestion(partId: number, rawQuery: unknown, now = new Date()): Promise<ReorderSuggestionDto> {
  const q = suggestionQuery.parse(rawQuery)
  const m = db().manager
  const part = await partOrFail(m, partId)
  const supplier = part.preferredSupplierId ? await m.findOneBy(Supplier, { id: part.preferredSupplierId }) : null
  const offer = supplier ? await m.findOneBy(SupplierPart, { partId, supplierId: supplier.id }) : null
  const unitCost = part.unitCost || (offer && offer.packSize > 0 ? offer.packPrice / offer.packSize : 0)
  const since = new Date(now.getTime() - q.windowDays * MS_PER_DAY)
  return buildReorderSuggestion({
    usage: await usageSince(m, partId, since),
    windowDays: q.windowDays,
    now,
    leadTimeDays: q.leadTimeDays ?? supplier?.leadTimeDays ?? DEFAULT_LEAD_TIME_DAYS,
    leadTimeFrom: q.leadTimeDays !== undefined ? 'given' : supplier ? 'supplier' : 'default',
    safetyStock: q.safetyStock,
    orderCost: q.orderCost ?? DEFAULT_ORDER_COST,
    holdingCostPerUnitYear: unitCost * (q.holdingRate ?? DEFAULT_HOLDING_RATE),
    packSize: offer?.packSize ?? 1,
  })
}

/** Sets a part's reorder point, reorder quantity and preferred supplier (storekeeper's decision). */
export const setReorderRules = (partId: number, raw: ReorderRulesInput) => inTransaction(async (tx) => {
  const input = reorderRulesInput.parse(raw)
  const part = await partOrFail(tx, partId)
  if (input.preferredSupplierId && !(await tx.existsBy(Supplier, { id: input.preferredSupplierId }))) {
    throw notFound('The supplier')
  }
  await tx.save(Part, Object.assign(part, input))
  // A new reorder point can open or clear a low-stock alert: let the alerts look again.
  touchPart(tx, partId)
  return partSupply(partId, tx)
})
