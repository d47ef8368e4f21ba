import * as mupdf from 'mupdf'
import jsQR from 'jsqr'

/** Render scale: 4 × 72 = 288 dpi, plenty for QR modules of half a millimetre. */
const SCALE = 4

export const openPdf = (bytes: Buffer | Uint8Array) => mupdf.Document.openDocument(bytes, 'application/pdf')

export const pageText = (doc: mupdf.Document, i: number) =>
  doc.loadPage(i).toStructuredText('preserve-whitespace').asText()

/** Renders one page and decodes the QR code inside a box given in mm from the top-left corner. */
export function decodeQrIn(doc: mupdf.Document, page: number, box: { xMm: number; yMm: number; wMm: number; hMm: number }) {
  // Opaque RGB on white (an alpha render leaves the paper transparent black); jsQR wants RGBA.
  const pix = doc.loadPage(page).toPixmap(mupdf.Matrix.scale(SCALE, SCALE), mupdf.ColorSpace.DeviceRGB, false, true)
  const px = (mm: number) => Math.round((mm / 25.4) * 72 * SCALE)
  const x0 = Math.max(0, px(box.xMm))
  const y0 = Math.max(0, px(box.yMm))
  const w = Math.min(px(box.wMm), pix.getWidth() - x0)
  const h = Math.min(px(box.hMm), pix.getHeight() - y0)
  const all = pix.getPixels()
  const stride = pix.getStride()
  const crop = new Uint8ClampedArray(w * h * 4)
  for (let y = 0; y < h; y++) {
    for (let x = 0; x < w; x++) {
      const from = (y0 + y) * stride + (x0 + x) * 3
      crop.set([all[from], all[from + 1], all[from + 2], 255], (y * w + x) * 4)
    }
  }
  return jsQR(crop, w, h)?.data
}
