import QRCode from 'qrcode'
import { notoSansPdf } from './pdf-doc'
import { labelPlaces, PAPERS, type SheetLayout } from '../../shared/domain/label-sheets'
import { darkRuns, LABEL_QR_LEVEL, qrModule } from '../../shared/domain/label-qr'
import { labelBoxes, labelLines, LABEL_PADDING_MM, LINE_HEIGHT, PT_MM, type Box, type LabelFields } from '../../shared/domain/label-layout'
import { CAUTIONS } from '../../shared/domain/cautions'
import type { LabelItemDto } from '../../shared/types/labels'

/** PDF user space is in points; the layout is in mm. */
const pt = (mm: number) => mm / PT_MM
const INK = '#000000'

export interface LabelPdfOptions {
  sheet: SheetLayout
  startPosition: number
  fields: LabelFields
}

/** Lays `items` out on `sheet` from `startPosition` and returns the PDF (vector QR codes, Noto Sans). */
export function renderLabelPdf(items: LabelItemDto[], opts: LabelPdfOptions): Promise<Buffer> {
  const { sheet } = opts
  const paper = PAPERS[sheet.paper]
  const { doc, done } = notoSansPdf({
    size: [pt(paper.widthMm), pt(paper.heightMm)], margin: 0, autoFirstPage: false,
    info: { Title: `Binwright labels · ${sheet.name}`, Creator: 'Binwright' },
  }, { regular: 'Noto', bold: 'NotoBold' })
  // Places come page by page, so each page is finished before the next begins (no buffering).
  let page = -1
  labelPlaces(sheet, items.length, opts.startPosition).forEach((place, i) => {
    while (page < place.page) { doc.addPage(); page++ }
    drawLabel(doc, items[i], place.xMm, place.yMm, opts)
  })
  doc.end()
  return done
}

type Doc = PDFKit.PDFDocument

function drawLabel(doc: Doc, item: LabelItemDto, xMm: number, yMm: number, opts: LabelPdfOptions) {
  const { labelWidthMm: w, labelHeightMm: h } = opts.sheet
  const caution = item.cautions.map((k) => CAUTIONS[k].short).join(' · ') || null
  const content = { code: item.code, name: item.name, detail: item.detail, caution, url: item.url }
  const boxes = labelBoxes(w, h, content, opts.fields)
  if (boxes.qr) drawQr(doc, item.url, xMm + boxes.qr.x, yMm + boxes.qr.y, boxes.qr.w)
  const cautionWord = item.cautions.map((k) => CAUTIONS[k].word).join(' · ')
  drawText(doc, { ...labelLines(content, opts.fields), cautionWord }, { ...boxes.text, x: xMm + boxes.text.x, y: yMm + boxes.text.y }, boxes.codePt, boxes.textPt)
}

/**
 * The QR code as filled rectangles, one per run of dark modules in a row (small files, sharp
 * print). Drawn in module units under one transform, as one content string: per-rectangle calls
 * and number formatting were most of the time of a 240-label sheet.
 */
function drawQr(doc: Doc, url: string, xMm: number, yMm: number, sideMm: number) {
  const { size, data } = QRCode.create(url, { errorCorrectionLevel: LABEL_QR_LEVEL }).modules
  const { moduleMm, marginMm } = qrModule(sideMm, size, LABEL_PADDING_MM)
  // A hair of overlap down the rows stops viewers drawing white seams between rectangles.
  const parts = darkRuns(size, data).map(({ row, start, length }) => `${start} ${row} ${length} 1.02 re`)
  const m = pt(moduleMm)
  doc.save()
  doc.transform(m, 0, 0, m, pt(xMm + marginMm), pt(yMm + marginMm))
  doc.addContent(parts.join('\n'))
  doc.fill(INK)
  doc.restore()
}

function drawText(doc: Doc, lines: ReturnType<typeof labelLines> & { cautionWord: string }, box: Box, codePt: number, textPt: number) {
  const x = pt(box.x)
  const width = pt(box.w)
  let y = pt(box.y)
  const bottom = pt(box.y + box.h)
  doc.fillColor(INK)
  if (lines.code) {
    doc.font('NotoBold').fontSize(codePt)
    // Shrink to the measured width when the estimate was generous (wide letters such as W or M).
    const measured = doc.widthOfString(lines.code)
    if (measured > width) doc.fontSize(codePt * (width / measured))
    doc.text(lines.code, x, y, { lineBreak: false })
    y += codePt * LINE_HEIGHT
  }
  doc.font('Noto').fontSize(textPt)
  const lineH = textPt * LINE_HEIGHT
  // Noto's own line height is about 1.36 em; close it up to the layout's so two name lines fit.
  const lineGap = lineH - doc.currentLineHeight()
  const cautionH = lines.caution ? lineH : 0
  if (lines.name && y + lineH <= bottom - cautionH + 0.01) {
    const room = bottom - cautionH - y - (lines.detail ? lineH : 0)
    const nameLines = room >= 2 * lineH - 0.01 ? 2 : 1
    // pdfkit decides on the ellipsis with the font's own line height, so give it that much room.
    doc.text(lines.name, x, y, { width, height: nameLines * doc.currentLineHeight(true) + 0.1, ellipsis: true, lineGap, lineBreak: nameLines > 1 })
    y = Math.min(doc.y, y + nameLines * lineH)
  }
  if (lines.detail && y + lineH <= bottom - cautionH + 0.01) {
    doc.text(lines.detail, x, y, { width, height: lineH, ellipsis: true, lineBreak: false })
  }
  if (lines.caution) drawCaution(doc, lines.caution, lines.cautionWord, x, bottom - lineH, width, textPt)
}

/** A warning triangle with "!" and the short caution, on the label's last line. */
function drawCaution(doc: Doc, text: string, short: string, x: number, y: number, width: number, size: number) {
  const s = size * 1.05
  doc.save()
  doc.polygon([x + s / 2, y + 0.5], [x + s, y + s], [x, y + s]).lineWidth(size / 10).lineJoin('round').stroke(INK)
  doc.font('NotoBold').fontSize(size * 0.72).text('!', x, y + s * 0.22, { width: s, align: 'center', lineBreak: false })
  doc.restore()
  const room = width - s - size * 0.3
  doc.font('NotoBold').fontSize(size)
  // On narrow labels keep the first word of each caution ("SDS", "Boiler") rather than an ellipsis.
  const fits = doc.widthOfString(text) <= room
  const shown = fits ? text : short
  doc.text(shown, x + s + size * 0.3, y, { width: room, height: size * LINE_HEIGHT, ellipsis: true, lineBreak: false })
}
