import QRCode from 'qrcode'
import { LABEL_QR_LEVEL } from '../../../shared/domain/label-qr'

/**
 * The QR code of `text` as one SVG path in module units (one rectangle per run of dark modules,
 * like the PDF), with the symbol's size in modules.
 */
export function qrPath(text: string): { d: string; modules: number } {
  const qr = QRCode.create(text, { errorCorrectionLevel: LABEL_QR_LEVEL })
  const n = qr.modules.size
  const data = qr.modules.data
  let d = ''
  for (let row = 0; row < n; row++) {
    let col = 0
    while (col < n) {
      if (!data[row * n + col]) { col++; continue }
      const start = col
      while (col < n && data[row * n + col]) col++
      d += `M${start} ${row}h${col - start}v1h${start - col}z`
    }
  }
  return { d, modules: n }
}
