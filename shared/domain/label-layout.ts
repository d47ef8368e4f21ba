/**
 * What goes where inside one label (mm from its top-left corner), shared by the PDF and the
 * on-screen preview so both print the same thing.
 */
import { qrFit, type QrFit } from './label-qr'

/** What the user chose to print on each label. */
export interface LabelFields {
  qr: boolean
  code: boolean
  name: boolean
  size: boolean
  caution: boolean
}
export const DEFAULT_LABEL_FIELDS: LabelFields = { qr: true, code: true, name: true, size: true, caution: true }

/** Blank border inside the label: keeps print off the die-cut edge and adds to the QR quiet zone. */
export const LABEL_PADDING_MM = 1.5
/** Space between the QR code and the text beside it. */
export const QR_TEXT_GAP_MM = 1
/** The QR takes at most this share of the label's width, so the code beside it stays readable. */
export const QR_MAX_WIDTH_SHARE = 0.55
/** One typographic point in mm (1/72 in). */
export const PT_MM = 25.4 / 72
/** Line height as a multiple of the font size. */
export const LINE_HEIGHT = 1.2
/**
 * Mean advance of Noto Sans Bold capitals and digits, in ems (about 0.62–0.66): used to size the
 * code to its box before the renderer measures it. [M: from the font's metrics, rounded up]
 */
export const CODE_EM_WIDTH = 0.66
/** Type sizes in points: the code as large as fits, the rest small but legible. */
export const CODE_PT = { min: 6, max: 36 }
export const TEXT_PT = { min: 5, max: 10 }

export interface Box { x: number; y: number; w: number; h: number }

export interface LabelBoxes {
  qr: (Box & { fit: QrFit }) | null
  text: Box
  /** Font sizes in pt for the code line and for the smaller lines. */
  codePt: number
  textPt: number
}

export interface LabelTextContent {
  code: string
  name: string
  detail: string
  caution: string | null
  /** The QR text (the URL); only its length matters here. */
  url: string
}

/** Lines the label will carry, in order, given the fields chosen and what the item has. */
export function labelLines(c: LabelTextContent, f: LabelFields) {
  return {
    code: f.code ? c.code : '',
    name: f.name ? c.name : '',
    detail: f.size ? c.detail : '',
    caution: f.caution && c.caution ? c.caution : '',
  }
}

/** Boxes and type sizes for one label of `widthMm` × `heightMm`. */
export function labelBoxes(widthMm: number, heightMm: number, c: LabelTextContent, f: LabelFields): LabelBoxes {
  const pad = LABEL_PADDING_MM
  const innerW = widthMm - 2 * pad
  const innerH = heightMm - 2 * pad
  let qr: LabelBoxes['qr'] = null
  let text: Box = { x: pad, y: pad, w: innerW, h: innerH }
  if (f.qr) {
    const side = Math.max(0, Math.min(innerH, innerW * QR_MAX_WIDTH_SHARE))
    qr = { x: pad, y: pad + (innerH - side) / 2, w: side, h: side, fit: qrFit(c.url, side, pad) }
    const x = pad + side + QR_TEXT_GAP_MM
    text = { x, y: pad, w: Math.max(0, widthMm - pad - x), h: innerH }
  }
  const lines = labelLines(c, f)
  const small = [lines.name ? 2 : 0, lines.detail ? 1 : 0, lines.caution ? 1 : 0].reduce((a, b) => a + b, 0)
  const textPt = clamp(text.h / Math.max(small + 2, 4) / LINE_HEIGHT / PT_MM, TEXT_PT.min, TEXT_PT.max)
  // The code gets what the smaller lines leave, and must fit across the box on one line.
  const codeHeightMm = text.h - small * textPt * LINE_HEIGHT * PT_MM
  const byHeight = codeHeightMm / LINE_HEIGHT / PT_MM
  const byWidth = text.w / (Math.max(lines.code.length, 1) * CODE_EM_WIDTH) / PT_MM
  const codePt = clamp(Math.min(byHeight, byWidth), CODE_PT.min, CODE_PT.max)
  return { qr, text, codePt, textPt }
}

const clamp = (n: number, lo: number, hi: number) => Math.max(lo, Math.min(hi, n))
