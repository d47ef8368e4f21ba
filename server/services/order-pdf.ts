import { notoSansPdf } from './pdf-doc'
import type { OrderDetailDto } from '../../shared/types/order'

/** A4 in points (ISO 216: 210 × 297 mm at 72 pt per inch). */
const A4: [number, number] = [595.28, 841.89]
const MARGIN = 50
const INK = '#1f2b31'
const RULE = '#9aa3a8'

/** Table columns: x offset from the margin and width, in points. */
const COLUMNS = [
  { key: 'n', title: '#', x: 0, w: 20, align: 'left' },
  { key: 'theirs', title: 'Your code', x: 22, w: 80, align: 'left' },
  { key: 'what', title: 'Description (our code)', x: 104, w: 196, align: 'left' },
  { key: 'packs', title: 'Packs', x: 302, w: 40, align: 'right' },
  { key: 'pack', title: 'Pack of', x: 344, w: 55, align: 'right' },
  { key: 'price', title: 'Pack price', x: 401, w: 44, align: 'right' },
  { key: 'total', title: 'Line total', x: 447, w: 48, align: 'right' },
] as const

const n = (x: number) => String(Math.round(x * 1000) / 1000)
const money = (x: number) => x.toFixed(2)

export interface OrderPdfContext {
  from: string
  contact: string
  date: string
}

/** The purchase order as a one- or several-page A4 PDF for the supplier. */
export function renderOrderPdf(order: OrderDetailDto, ctx: OrderPdfContext): Promise<Buffer> {
  const { doc, done } = notoSansPdf(
    { size: A4, margin: MARGIN, info: { Title: `Purchase order ${order.number}`, Author: ctx.from } },
    { regular: 'body', bold: 'bold' },
  )

  doc.fillColor(INK).font('bold').fontSize(18).text(`Purchase order ${order.number}`)
  doc.font('body').fontSize(10).moveDown(0.3)
  doc.text(`From: ${ctx.from}`).text(`Contact: ${ctx.contact}`).text(`Date: ${ctx.date}`)
  doc.moveDown(0.5).text(`To: ${order.supplierName}${order.supplierEmail ? ` <${order.supplierEmail}>` : ''}`)
  if (order.expectedOn) doc.text(`Wanted by: ${order.expectedOn}`)
  doc.moveDown(1)
  table(doc, order)
  doc.moveDown(1).font('body').fontSize(10).fillColor(INK)
  if (order.notes) doc.text(`Notes: ${order.notes}`, MARGIN, doc.y, { width: A4[0] - 2 * MARGIN }).moveDown(0.5)
  doc.text(`Please quote ${order.number} on the delivery note and the invoice, and tell us at once if any item cannot be supplied.`,
    MARGIN, doc.y, { width: A4[0] - 2 * MARGIN })
  doc.end()
  return done
}

function row(doc: PDFKit.PDFDocument, cells: Record<string, string>, font: 'body' | 'bold') {
  const y = doc.y
  doc.font(font).fontSize(9)
  let bottom = y
  for (const c of COLUMNS) {
    doc.text(cells[c.key] ?? '', MARGIN + c.x, y, { width: c.w, align: c.align })
    bottom = Math.max(bottom, doc.y)
  }
  doc.y = bottom + 3
}

function table(doc: PDFKit.PDFDocument, order: OrderDetailDto) {
  const rule = () => doc.moveTo(MARGIN, doc.y).lineTo(A4[0] - MARGIN, doc.y).strokeColor(RULE).lineWidth(0.5).stroke()
  row(doc, Object.fromEntries(COLUMNS.map((c) => [c.key, c.title])), 'bold')
  rule()
  doc.y += 3
  order.lines.forEach((l, i) => {
    if (doc.y > A4[1] - MARGIN - 40) doc.addPage()
    row(doc, {
      n: String(i + 1), theirs: l.supplierCode || '–', what: `${l.partName} (${l.partCode})`,
      packs: String(l.packs), pack: `${n(l.packSize)} ${l.unit}`, price: money(l.packPrice), total: money(l.lineCost),
    }, 'body')
  })
  rule()
  doc.y += 3
  row(doc, { what: `${order.lines.length} line(s)`, price: 'Total', total: money(order.total) }, 'bold')
}
