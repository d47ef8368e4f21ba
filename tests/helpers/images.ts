/** Real image and PDF bytes made in tests (jimp and pdfkit), and EXIF tagging for orientation. */
import { Jimp } from 'jimp'
import PDFDocument from 'pdfkit'

/** RGBA colours used to find corners after rotation. */
export const RED = 0xff0000ff
export const BLUE = 0x0000ffff
export const GREY = 0x808080ff

/**
 * A w×h picture: grey, with a red square in the top-left corner and a blue one in the top-right,
 * so a test can tell which way the image was turned. `noise` adds smooth shading and a little
 * grain, so a 12 MP JPEG comes out at a phone photo's few megabytes rather than a flat 200 KB.
 */
export function picture(w: number, h: number, noise = false) {
  const img = new Jimp({ width: w, height: h, color: GREY })
  const mark = Math.max(4, Math.round(Math.min(w, h) / 8))
  let seed = 12345
  const grain = () => ((seed = (seed * 1103515245 + 12345) & 0x7fffffff) % 25) - 12
  img.scan(0, 0, w, h, (x, y, idx) => {
    const d = img.bitmap.data
    if (y < mark && x < mark) d.writeUInt32BE(RED, idx)
    else if (y < mark && x >= w - mark) d.writeUInt32BE(BLUE, idx)
    else if (noise) {
      const shade = 60 + Math.round(120 * (0.5 + 0.25 * Math.sin(x / 90) + 0.25 * Math.cos(y / 70)))
      d[idx] = shade + grain(); d[idx + 1] = shade - 10 + grain(); d[idx + 2] = shade - 25 + grain()
    }
  })
  return img
}

/** A real 1×1 lossless WebP (the widely used feature-detection image); jimp cannot make WebP. */
export const WEBP_1X1 = Buffer.from('UklGRhoAAABXRUJQVlA4TA0AAAAvAAAAEAcQERGIiP4HAA==', 'base64')

export const pngBytes = (w: number, h: number) => picture(w, h).getBuffer('image/png')
export const gifBytes = (w: number, h: number) => picture(w, h).getBuffer('image/gif')
export const jpegBytes = (w: number, h: number, noise = false, quality = 85) =>
  picture(w, h, noise).getBuffer('image/jpeg', { quality })

/**
 * Inserts an EXIF APP1 segment holding only the Orientation tag (0x0112) after the JPEG's SOI
 * marker. Layout from the EXIF 2.3 specification (TIFF header, IFD0 with one SHORT entry).
 */
export function withExifOrientation(jpeg: Buffer, orientation: number): Buffer {
  const tiff = Buffer.alloc(26)
  tiff.write('MM', 0, 'ascii') // big-endian TIFF
  tiff.writeUInt16BE(0x002a, 2)
  tiff.writeUInt32BE(8, 4) // IFD0 right after the header
  tiff.writeUInt16BE(1, 8) // one entry
  tiff.writeUInt16BE(0x0112, 10) // Orientation
  tiff.writeUInt16BE(3, 12) // SHORT
  tiff.writeUInt32BE(1, 14) // one value
  tiff.writeUInt16BE(orientation, 18) // value, left-justified in the 4-byte field
  tiff.writeUInt32BE(0, 22) // no next IFD
  const payload = Buffer.concat([Buffer.from('Exif\0\0', 'binary'), tiff])
  const header = Buffer.alloc(4)
  header.writeUInt16BE(0xffe1, 0)
  header.writeUInt16BE(payload.length + 2, 2)
  return Buffer.concat([jpeg.subarray(0, 2), header, payload, jpeg.subarray(2)])
}

/** A one-page PDF drawing made with pdfkit (its built-in Helvetica; no font files needed). */
export function pdfBytes(title = 'Steam chest cover, 1:1'): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ size: 'A4' })
    const chunks: Buffer[] = []
    doc.on('data', (c: Buffer) => chunks.push(c))
    doc.on('end', () => resolve(Buffer.concat(chunks)))
    doc.on('error', reject)
    doc.fontSize(18).text(title)
    doc.rect(72, 140, 200, 120).stroke()
    doc.end()
  })
}

/** A PNG whose header claims an enormous size: a "decompression bomb" in 45 bytes. */
export function hugePngHeader(w = 100_000, h = 100_000): Buffer {
  const sig = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])
  const ihdr = Buffer.alloc(25)
  ihdr.writeUInt32BE(13, 0)
  ihdr.write('IHDR', 4, 'ascii')
  ihdr.writeUInt32BE(w, 8)
  ihdr.writeUInt32BE(h, 12)
  ihdr[16] = 8 // bit depth
  ihdr[17] = 6 // RGBA
  return Buffer.concat([sig, ihdr, Buffer.alloc(12)])
}

/** Width, height and the RGBA colour at (x, y) of image bytes. */
export async function inspect(bytes: Buffer, at: [number, number][] = []) {
  const img = await Jimp.fromBuffer(bytes)
  return {
    width: img.bitmap.width,
    height: img.bitmap.height,
    colours: at.map(([x, y]) => img.getPixelColor(x, y)),
  }
}
