import { db, inTransaction } from '../db'
import { PurchaseOrder, Supplier, User } from '../entities'
import { conflict, notFound } from '../errors'
import { deliver, queueMail } from './mail'
import { notifyConfig } from './notify-config'
import { lockedOrder, orderDetail, workshopName } from './orders'
import { renderOrderPdf } from './order-pdf'
import { todayIso } from './stock-guards'
import type { OrderDetailDto } from '../../shared/types/order'

const MS_PER_DAY = 86_400_000
const n = (x: number) => String(Math.round(x * 1000) / 1000)

/** The order as plain text: the same lines the PDF carries, readable in any mail program. */
export function orderText(order: OrderDetailDto, from: string, contact: string): string {
  return [
    `Dear ${order.supplierName},`, '',
    `Please supply the following (our order ${order.number}):`, '',
    ...order.lines.map((l, i) =>
      `${i + 1}. ${l.supplierCode ? `[${l.supplierCode}] ` : ''}${l.partName} (our code ${l.partCode}): ${l.packs} pack(s) of ${n(l.packSize)} ${l.unit} at ${l.packPrice.toFixed(2)} a pack = ${l.lineCost.toFixed(2)}`),
    '', `Total: ${order.total.toFixed(2)}`,
    ...(order.expectedOn ? [`Wanted by: ${order.expectedOn}`] : []),
    ...(order.notes ? ['', `Notes: ${order.notes}`] : []),
    '', `Please quote ${order.number} on the delivery note and the invoice. The order is attached as a PDF.`,
    '', 'Thank you,', contact, from,
  ].join('\n')
}

/** A fingerprint of the lines, so a draft changed while the PDF was being made is not sent stale. */
const fingerprint = (o: OrderDetailDto) => JSON.stringify(o.lines.map((l) => [l.partId, l.quantity, l.packPrice]))

/**
 * Sends a draft: e-mails the supplier the order as text with a PDF attached (through the
 * outbox, retried on failure), marks it sent and sets the expected date from the lead time.
 */
export async function sendOrder(id: number, userId: number): Promise<OrderDetailDto> {
  const draft = await orderDetail(id)
  if (draft.status !== 'draft') throw conflict('ORDER_STATUS', `${draft.number} is ${draft.status}; only a draft can be sent.`)
  if (!draft.lines.length) throw conflict('ORDER_EMPTY', `${draft.number} has no lines to send.`)
  if (!draft.supplierEmail) throw conflict('SUPPLIER_NO_EMAIL', `${draft.supplierName} has no e-mail address: add one on the Suppliers page first.`)
  const sender = await db().manager.findOneBy(User, { id: userId })
  const from = await workshopName()
  const contact = sender ? `${sender.displayName}${sender.email ? ` <${sender.email}>` : ''}` : notifyConfig().SMTP_FROM
  const pdf = await renderOrderPdf(draft, { from, contact, date: todayIso() })
  const msgId = await inTransaction(async (tx) => {
    const order = await lockedOrder(tx, id, ['draft'], 'sent')
    if (fingerprint(await orderDetail(id, tx)) !== fingerprint(draft)) {
      throw conflict('ORDER_CHANGED', `${draft.number} changed while it was being sent: look it over and send again.`)
    }
    const supplier = await tx.findOneBy(Supplier, { id: order.supplierId })
    if (!supplier) throw notFound('The supplier')
    const msg = await queueMail(tx, {
      to: [supplier.email],
      subject: `Purchase order ${order.number} from ${from}`,
      text: orderText(draft, from, contact),
      attachments: [{ filename: `${order.number}.pdf`, contentType: 'application/pdf', content: pdf }],
    })
    const now = new Date()
    await tx.update(PurchaseOrder, { id }, {
      status: 'sent', sentAt: now.toISOString(),
      expectedOn: order.expectedOn ?? todayIso(new Date(now.getTime() + supplier.leadTimeDays * MS_PER_DAY)),
    })
    return msg.id
  })
  await deliver(msgId)
  return orderDetail(id)
}

/** The order's PDF as it would be sent now (for a look before sending, or a copy after). */
export async function orderPdf(id: number, userId: number): Promise<{ number: string; pdf: Buffer }> {
  const order = await orderDetail(id)
  const sender = await db().manager.findOneBy(User, { id: userId })
  const pdf = await renderOrderPdf(order, {
    from: await workshopName(), contact: sender?.displayName ?? '', date: (order.sentAt ?? new Date().toISOString()).slice(0, 10),
  })
  return { number: order.number, pdf }
}
