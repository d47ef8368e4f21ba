import { writeFileSync } from 'node:fs'
import QRCode from 'qrcode'

/** Frame size of the fake camera: 640 × 480 is what most webcams offer by default. */
const WIDTH = 640
const HEIGHT = 480
/** Quiet zone around a QR symbol, in modules (ISO/IEC 18004 asks for 4). */
const QUIET_MODULES = 4
/** Y4M luma for white paper and black print (full-range 4:2:0, "C420jpeg"). */
const WHITE = 235
const BLACK = 16
/** Neutral chroma: grey, no colour cast. */
const NEUTRAL_CHROMA = 128

/**
 * Writes a Y4M video (a text header, then raw YUV 4:2:0 frames) showing `text` as a QR label,
 * black on white, centred and as large as fits. Chromium plays it through
 * `--use-file-for-fake-video-capture` as if a camera were pointing at the label.
 */
export function writeQrY4m(path: string, text: string, frames = 2) {
  const qr = QRCode.create(text, { errorCorrectionLevel: 'M' })
  const size = qr.modules.size
  const scale = Math.floor(Math.min(WIDTH, HEIGHT) / (size + 2 * QUIET_MODULES))
  const left = Math.floor((WIDTH - size * scale) / 2)
  const top = Math.floor((HEIGHT - size * scale) / 2)
  const luma = Buffer.alloc(WIDTH * HEIGHT, WHITE)
  for (let y = 0; y < size * scale; y++) {
    for (let x = 0; x < size * scale; x++) {
      if (qr.modules.get(Math.floor(y / scale), Math.floor(x / scale))) luma[(top + y) * WIDTH + left + x] = BLACK
    }
  }
  const chroma = Buffer.alloc((WIDTH / 2) * (HEIGHT / 2) * 2, NEUTRAL_CHROMA)
  const header = Buffer.from(`YUV4MPEG2 W${WIDTH} H${HEIGHT} F10:1 Ip A1:1 C420jpeg\n`)
  const frame = Buffer.concat([Buffer.from('FRAME\n'), luma, chroma])
  writeFileSync(path, Buffer.concat([header, ...Array.from({ length: frames }, () => frame)]))
}
