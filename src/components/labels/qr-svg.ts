import QRCode from 'qrcode'
import { darkRuns, LABEL_QR_LEVEL } from '../../../shared/domain/label-qr'

/**
 * The QR code of `text` as one SVG path in module units (one rectangle per run of dark modules,
 * like the PDF), with the symbol's size in modules.
 */
export function qrPath(text: string): { d: string; modules: number } {
  const { size, data } = QRCode.create(text, { errorCorrectionLevel: LABEL_QR_LEVEL }).modules
  const d = darkRuns(size, data).map(({ row, start, length }) => `M${start} ${row}h${length}v1h${-length}z`).join('')
  return { d, modules: size }
}
