import { In, Like, type EntityManager, type FindOptionsWhere } from 'typeorm'
import { db, inTransaction } from '../db'
import { Bin, OutboxMessage, Part, PurchaseLine, PurchaseOrder, StockLot, Supplier, SupplierPart, User, Workshop } from '../entities'
import { conflict, notFound } from '../errors'
import { getSetting } from './settings'
import { todayIso } from './stock-guards'
import { OPEN_ORDER_STATUSES } from './supply'
import {
  orderCreateInput, orderPatchInput, OPEN_FILTER, type OrderCreateInput, type OrderLineInput, type OrderListQuery,
  type OrderPatchInput,
} from '../../shared/schemas/order'
import type { Page } from '../../shared/types/api'
import type { OrderStatus } from '../../shared/types/domain'
import type { OrderDetailDto, OrderLineDto, OrderSummaryDto } from '../../shared/types/order'

type Manager = EntityManager
/** Orders still waiting for goods: these can be late. */
const AWAITING: OrderStatus[] = ['sent', 'part-received']
const cents = (x: number) => Math.round(x * 100) / 100
const iso = (d: Date | string) => new Date(d).toISOString()

export const isLate = (o: Pick<PurchaseOrder, 'status' | 'expectedOn'>, today = todayIso()) =>
  AWAITING.includes(o.status) && !!o.expectedOn && o.expectedOn < today

/** The name printed on orders: the admin's workshop name, else the first workshop's. */
export async function workshopName(m: Manager = db().manager): Promise<string> {
  const set = await getSetting<string | null>('workshopName', null)
  return set ?? (await m.find(Workshop, { order: { id: 'ASC' }, take: 1 }))[0]?.name ?? 'Binwright stores'
}

async function summaries(m: Manager, orders: PurchaseOrder[]): Promise<OrderSummaryDto[]> {
  if (!orders.length) return []
  const ids = orders.map((o) => o.id)
  const lines = await m.findBy(PurchaseLine, { orderId: In(ids) })
  const suppliers = new Map((await m.findBy(Supplier, { id: In(orders.map((o) => o.supplierId)) })).map((s) => [s.id, s]))
  const users = new Map((await m.findBy(User, { id: In(orders.map((o) => o.createdById)) })).map((u) => [u.id, u]))
  const today = todayIso()
  return orders.map((o) => {
    const mine = lines.filter((l) => l.orderId === o.id)
    return {
      id: o.id, number: o.number, supplierId: o.supplierId, supplierName: suppliers.get(o.supplierId)?.name ?? '?',
      status: o.status, lineCount: mine.length,
      total: cents(mine.reduce((a, l) => a + (l.quantity / l.packSize) * l.packPrice, 0)),
      createdAt: iso(o.createdAt), createdByName: users.get(o.createdById)?.displayName ?? '?',
      sentAt: o.sentAt, expectedOn: o.expectedOn, late: isLate(o, today),
    }
  })
}

export async function listOrders(q: OrderListQuery): Promise<Page<OrderSummaryDto>> {
  const m = db().manager
  const page = q.page ?? 1
  const pageSize = q.pageSize ?? 50
  const where: FindOptionsWhere<PurchaseOrder> = {}
  if (q.status === OPEN_FILTER) where.status = In(OPEN_ORDER_STATUSES)
  else if (q.status) where.status = q.status
  if (q.late) where.status = In(AWAITING)
  if (q.supplierId) where.supplierId = q.supplierId
  let rows = await m.find(PurchaseOrder, { where, order: { id: 'DESC' } })
  if (q.late) rows = rows.filter((o) => isLate(o))
  const items = await summaries(m, rows.slice((page - 1) * pageSize, page * pageSize))
  return { items, total: rows.length, page, pageSize }
}

export async function orderDetail(id: number, m: Manager = db().manager): Promise<OrderDetailDto> {
  const order = await m.findOneBy(PurchaseOrder, { id })
  if (!order) throw notFound('The order')
  const [summary] = await summaries(m, [order])
  const lines = await m.find(PurchaseLine, { where: { orderId: id }, order: { id: 'ASC' } })
  const parts = new Map((await m.findBy(Part, { id: In(lines.map((l) => l.partId)) })).map((p) => [p.id, p]))
  const offers = new Map((await m.findBy(SupplierPart, { supplierId: order.supplierId, partId: In(lines.map((l) => l.partId)) })).map((o) => [o.partId, o]))
  const supplier = await m.findOneBy(Supplier, { id: order.supplierId })
  const homes = await homeBins(m, lines.map((l) => l.partId))
  const emails = await m.find(OutboxMessage, { where: { subject: Like(`% ${order.number} %`) }, order: { id: 'ASC' } })
  return {
    ...summary, notes: order.notes, supplierEmail: supplier?.email ?? '',
    lines: lines.map((l): OrderLineDto => {
      const p = parts.get(l.partId)
      return {
        id: l.id, partId: l.partId, partCode: p?.code ?? '?', partName: p?.name ?? '?', kind: p?.kind ?? 'other', unit: p?.unit ?? '',
        supplierCode: offers.get(l.partId)?.supplierCode ?? '', quantity: l.quantity, packSize: l.packSize,
        packs: Math.round(l.quantity / l.packSize), packPrice: l.packPrice, lineCost: cents((l.quantity / l.packSize) * l.packPrice),
        receivedQuantity: l.receivedQuantity, remaining: Math.max(0, l.quantity - l.receivedQuantity),
        suggestedBinId: homes.get(l.partId) ?? null,
      }
    }),
    emails: emails.map((e) => ({ id: e.id, to: e.to, status: e.status, tries: e.tries, lastError: e.lastError, sentAt: e.sentAt })),
  }
}

/** Each part's home bin: the open bin of its biggest lot, else an open bin whose default part it is. */
async function homeBins(m: Manager, partIds: number[]): Promise<Map<number, number>> {
  const homes = new Map<number, number>()
  if (!partIds.length) return homes
  const lots = await m.find(StockLot, { where: { partId: In(partIds) }, order: { quantity: 'DESC' } })
  const bins = await m.findBy(Bin, { retired: false })
  const open = new Set(bins.map((b) => b.id))
  for (const l of lots) if (open.has(l.binId) && !homes.has(l.partId)) homes.set(l.partId, l.binId)
  for (const b of bins) if (b.defaultPartId && partIds.includes(b.defaultPartId) && !homes.has(b.defaultPartId)) homes.set(b.defaultPartId, b.id)
  return homes
}

/** Next number in the PO-0001 series (orders are never deleted, only cancelled). */
async function nextNumber(tx: Manager) {
  const last = (await tx.find(PurchaseOrder, { order: { id: 'DESC' }, take: 1 }))[0]
  const n = last ? Number(/(\d+)$/.exec(last.number)?.[1] ?? 0) + 1 : 1
  return `PO-${String(n).padStart(4, '0')}`
}

/** Lines priced from the supplier's offers unless the request gives pack size and price. */
async function buildLines(tx: Manager, supplierId: number, orderId: number, input: OrderLineInput[]) {
  const parts = new Map((await tx.findBy(Part, { id: In(input.map((l) => l.partId)) })).map((p) => [p.id, p]))
  const offers = new Map((await tx.findBy(SupplierPart, { supplierId, partId: In(input.map((l) => l.partId)) })).map((o) => [o.partId, o]))
  return input.map((l) => {
    const part = parts.get(l.partId)
    if (!part) throw notFound(`Part ${l.partId}`)
    if (part.archived) throw conflict('PART_ARCHIVED', `${part.code} is archived; restore it before ordering.`)
    const offer = offers.get(l.partId)
    const packSize = l.packSize ?? offer?.packSize ?? 1
    const packPrice = l.packPrice ?? offer?.packPrice ?? cents(part.unitCost * packSize)
    return tx.create(PurchaseLine, { orderId, partId: l.partId, quantity: l.packs * packSize, packSize, packPrice, receivedQuantity: 0 })
  })
}

export const createOrder = (raw: OrderCreateInput, userId: number) => inTransaction(async (tx) => {
  const input = orderCreateInput.parse(raw)
  if (!(await tx.existsBy(Supplier, { id: input.supplierId }))) throw notFound('The supplier')
  const order = await tx.save(PurchaseOrder, tx.create(PurchaseOrder, {
    number: await nextNumber(tx), supplierId: input.supplierId, status: 'draft', createdById: userId,
    sentAt: null, expectedOn: input.expectedOn ?? null, notes: input.notes,
  }))
  await tx.save(PurchaseLine, await buildLines(tx, input.supplierId, order.id, input.lines))
  return orderDetail(order.id, tx)
})

export async function lockedOrder(tx: Manager, id: number, allowed: OrderStatus[], doing: string) {
  const order = await tx.findOneBy(PurchaseOrder, { id })
  if (!order) throw notFound('The order')
  if (!allowed.includes(order.status)) {
    throw conflict('ORDER_STATUS', `${order.number} is ${order.status}; only a ${allowed.join(' or ')} order can be ${doing}.`,
      { status: order.status })
  }
  return order
}

export const updateDraft = (id: number, raw: OrderPatchInput) => inTransaction(async (tx) => {
  const input = orderPatchInput.parse(raw)
  const order = await lockedOrder(tx, id, ['draft'], 'changed')
  if (input.notes !== undefined) order.notes = input.notes
  if (input.expectedOn !== undefined) order.expectedOn = input.expectedOn
  await tx.save(PurchaseOrder, order)
  if (input.lines) {
    await tx.delete(PurchaseLine, { orderId: id })
    await tx.save(PurchaseLine, await buildLines(tx, order.supplierId, id, input.lines))
  }
  return orderDetail(id, tx)
})

/** Cancel: a draft, or a sent order nothing has arrived against. */
export const cancelOrder = (id: number) => inTransaction(async (tx) => {
  const order = await lockedOrder(tx, id, ['draft', 'sent'], 'cancelled (once goods arrive, close it instead)')
  await tx.update(PurchaseOrder, { id }, { status: 'cancelled' })
  return orderDetail(order.id, tx)
})

/** Close: nothing more will come (a short delivery accepted, or a fully received order filed). */
export const closeOrder = (id: number) => inTransaction(async (tx) => {
  await lockedOrder(tx, id, ['part-received', 'received'], 'closed (cancel an order nothing has arrived against)')
  await tx.update(PurchaseOrder, { id }, { status: 'closed' })
  return orderDetail(id, tx)
})
