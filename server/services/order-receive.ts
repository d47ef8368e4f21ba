import { In, type EntityManager } from 'typeorm'
import { inTransaction } from '../db'
import { Part, PurchaseLine, PurchaseOrder } from '../entities'
import { badRequest, conflict } from '../errors'
import { QUANTITY_EPSILON } from './ledger'
import { receiveInto } from './stock'
import { stockTotalsOf } from './stock-totals'
import { lockedOrder, orderDetail } from './orders'
import { orderReceiveInput, type OrderReceiveInput, type ReceiptLineInput } from '../../shared/schemas/order'
import { stockModeOf } from '../../shared/types/domain'
import type { OrderDetailDto } from '../../shared/types/order'

const n = (x: number) => Math.round(x * 1000) / 1000
/** What a receipt line brings in: items or containers, or pieces × length for bar stock. */
const incoming = (r: { quantity: number; pieces?: number }) => r.quantity * (r.pieces ?? 1)

/**
 * Moving weighted average cost (common practice): the stock already there keeps its cost, the
 * new stock comes in at the order's price. An unknown old cost (0) takes the new one.
 */
export function averageCost(onHand: number, oldCost: number, received: number, newCost: number) {
  if (!(oldCost > 0) || !(onHand > 0)) return newCost
  return (onHand * oldCost + received * newCost) / (onHand + received)
}

function overReceipts(lines: Map<number, PurchaseLine>, receipts: ReceiptLineInput[], parts: Map<number, Part>) {
  const totals = new Map<number, number>()
  for (const r of receipts) totals.set(r.lineId, (totals.get(r.lineId) ?? 0) + incoming(r))
  return [...totals].flatMap(([lineId, qty]) => {
    const line = lines.get(lineId)!
    const over = line.receivedQuantity + qty - line.quantity
    return over > QUANTITY_EPSILON
      ? [{ lineId, partCode: parts.get(line.partId)?.code ?? '?', ordered: line.quantity, alreadyReceived: line.receivedQuantity, receiving: n(qty), over: n(over) }]
      : []
  })
}

async function receiveLine(tx: EntityManager, order: PurchaseOrder, line: PurchaseLine, part: Part, r: ReceiptLineInput, userId: number) {
  const amount = incoming(r)
  const before = await stockTotalsOf(part.id, tx)
  await receiveInto(tx, {
    partId: part.id, binId: r.binId, quantity: r.quantity, pieces: r.pieces, batchCode: r.batchCode, expiresOn: r.expiresOn,
    purchaseOrderId: order.id, reason: `Received against ${order.number}`,
  }, userId)
  line.receivedQuantity = n(line.receivedQuantity + amount)
  await tx.update(PurchaseLine, { id: line.id }, { receivedQuantity: line.receivedQuantity })
  part.unitCost = averageCost(before.onHand, part.unitCost, amount, line.packSize > 0 ? line.packPrice / line.packSize : 0)
  await tx.update(Part, { id: part.id }, { unitCost: part.unitCost })
}

/**
 * Receives goods against a sent order into chosen bins, all lines in one transaction: ledger
 * receive movements linked to the order, received quantities, the parts' unit costs and the
 * order's status. More than ordered is refused (409 OVER_RECEIPT) unless confirmed.
 */
export const receiveOrder = (id: number, raw: OrderReceiveInput, userId: number): Promise<OrderDetailDto> => inTransaction(async (tx) => {
  const input = orderReceiveInput.parse(raw)
  const order = await lockedOrder(tx, id, ['sent', 'part-received'], 'received against')
  const lines = new Map((await tx.findBy(PurchaseLine, { orderId: id })).map((l) => [l.id, l]))
  for (const r of input.lines) {
    if (!lines.has(r.lineId)) throw badRequest('NOT_ON_ORDER', `Line ${r.lineId} is not on ${order.number}.`)
  }
  const parts = new Map((await tx.findBy(Part, { id: In([...lines.values()].map((l) => l.partId)) })).map((p) => [p.id, p]))
  for (const r of input.lines) {
    const part = parts.get(lines.get(r.lineId)!.partId)!
    if (r.pieces > 1 && stockModeOf(part.kind) !== 'length') {
      throw badRequest('PIECES_FOR_BAR_ONLY', `${part.code}: pieces apply to bar, tube and sheet stock only.`)
    }
  }
  const over = overReceipts(lines, input.lines, parts)
  if (over.length && !input.confirmOverReceipt) {
    throw conflict('OVER_RECEIPT',
      `More than was ordered: ${over.map((o) => `${o.partCode} +${o.over}`).join(', ')}. Confirm to receive it anyway. Nothing was changed.`, over)
  }
  for (const r of input.lines) {
    const line = lines.get(r.lineId)!
    await receiveLine(tx, order, line, parts.get(line.partId)!, r, userId)
  }
  const all = [...lines.values()]
  const complete = all.every((l) => l.receivedQuantity >= l.quantity - QUANTITY_EPSILON)
  await tx.update(PurchaseOrder, { id }, { status: complete ? 'received' : 'part-received' })
  return orderDetail(id, tx)
})
