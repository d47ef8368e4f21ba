import { fileTypeFromBuffer } from 'file-type'
import { imageSize } from 'image-size'
import { randomBytes } from 'node:crypto'
import { AppError } from '../errors'
import { ACCEPTED_MIME_TYPES, type AcceptedMime } from '../../shared/types/attachment'

/** File-name extension stored for each accepted type (the client's name is never used). */
const EXTENSION: Record<AcceptedMime, string> = {
  'image/png': 'png',
  'image/jpeg': 'jpg',
  'image/webp': 'webp',
  'image/gif': 'gif',
  'application/pdf': 'pdf',
}

/** Displayed names are cut to this many characters (the column holds 200). */
export const MAX_DISPLAY_NAME = 120
/** Random bytes in a stored name: 128 bits, so names can be neither guessed nor collide. */
const STORED_NAME_BYTES = 16

const isAccepted = (mime: string): mime is AcceptedMime =>
  (ACCEPTED_MIME_TYPES as readonly string[]).includes(mime)

/**
 * The file's type judged from its bytes (magic numbers), never from its name or the browser's
 * Content-Type. SVG is text to file-type and so refused too: it can carry scripts.
 */
export async function judgeFileType(bytes: Buffer): Promise<AcceptedMime> {
  const found = await fileTypeFromBuffer(bytes)
  if (found && isAccepted(found.mime)) return found.mime
  const what = found
    ? `The file's contents are ${found.ext.toUpperCase()} (${found.mime}), which is not accepted.`
    : "The file's contents are not an image or PDF we can read (we judge by the contents, not the name)."
  throw new AppError(415, 'UNSUPPORTED_FILE_TYPE',
    `${what} Upload a PNG, JPEG, WebP or GIF image, or a PDF drawing.`,
    { detected: found?.mime ?? null, accepted: ACCEPTED_MIME_TYPES })
}

/**
 * Largest image accepted, in pixels: 100 megapixels covers any phone or scanner drawing, while
 * a "decompression bomb" whose small file claims 100,000 × 100,000 pixels (40 GB decoded) is refused.
 */
export const MAX_IMAGE_PIXELS = 100_000_000

const PNG_END = Buffer.from([0, 0, 0, 0, 0x49, 0x45, 0x4e, 0x44, 0xae, 0x42, 0x60, 0x82]) // IEND chunk
const JPEG_END = Buffer.from([0xff, 0xd9]) // EOI marker
const GIF_END = 0x3b // trailer byte

/**
 * Where a JPEG's first scan starts, walking the marker segments from the start so that an EXIF
 * thumbnail (inside an APP1 segment, with its own end marker) is skipped. -1 when there is none.
 */
function jpegScanStart(bytes: Buffer): number {
  let at = 2
  while (at + 4 <= bytes.length && bytes[at] === 0xff) {
    const marker = bytes[at + 1]
    if (marker === 0xda) return at
    if (marker === 0xff) { at += 1; continue } // fill byte
    at += 2 + bytes.readUInt16BE(at + 2)
  }
  return -1
}

/** True when the image's own end marker is there: a file cut short in transfer has none. */
function isComplete(bytes: Buffer, mime: AcceptedMime): boolean {
  switch (mime) {
    // Nothing may follow IEND in a PNG.
    case 'image/png': return bytes.subarray(-PNG_END.length).equals(PNG_END)
    // Stuffing keeps FF D9 out of scan data, so any EOI after the first scan ends the image;
    // some cameras append their own data after it, which is fine.
    case 'image/jpeg': {
      const scan = jpegScanStart(bytes)
      return scan > 0 && bytes.indexOf(JPEG_END, scan) > 0
    }
    case 'image/gif': return bytes[bytes.length - 1] === GIF_END
    // WebP and PDF are never decoded here (no thumbnails), so there is nothing to protect.
    default: return true
  }
}

/**
 * Refuses, before anything is stored, an image cut short in transfer (no end marker) or one
 * whose header claims more pixels than MAX_IMAGE_PIXELS. Both would only fail later, in the
 * thumbnail worker, leaving a drawing nobody can see.
 */
export function checkImage(bytes: Buffer, mime: AcceptedMime) {
  if (mime === 'application/pdf') return
  let size: { width?: number; height?: number }
  try {
    size = imageSize(bytes)
  } catch {
    throw new AppError(422, 'DAMAGED_IMAGE', "The image's header cannot be read: the file is damaged. Export or save it again and upload the new file.")
  }
  const { width = 0, height = 0 } = size
  if (width * height > MAX_IMAGE_PIXELS) {
    throw new AppError(413, 'IMAGE_TOO_LARGE',
      `The image is ${width.toLocaleString('en-GB')} × ${height.toLocaleString('en-GB')} pixels; the largest accepted is ${MAX_IMAGE_PIXELS / 1e6} megapixels. Scale it down and upload it again.`,
      { width, height, maxPixels: MAX_IMAGE_PIXELS })
  }
  if (!isComplete(bytes, mime)) {
    throw new AppError(422, 'DAMAGED_IMAGE',
      'The image ends too soon: it was cut short while copying or uploading. Upload the whole file again.')
  }
}

/** A fresh random stored name with the extension of the judged type: "9f…c1.jpg". */
export const newStoredName = (mime: AcceptedMime) =>
  `${randomBytes(STORED_NAME_BYTES).toString('hex')}.${EXTENSION[mime]}`

/** Thumbnails are JPEG for JPEG photos (small) and PNG otherwise (keeps transparency). */
export const thumbName = (storedName: string, mime: string, width: number) =>
  `${storedName.replace(/\.[a-z]+$/, '')}-${width}.${mime === 'image/jpeg' ? 'jpg' : 'png'}`

export const thumbMime = (mime: string) => (mime === 'image/jpeg' ? 'image/jpeg' : 'image/png')

/** Control characters, and bidi overrides that can make "gpj.exe" read as "exe.jpg". */
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const UNSAFE_CHARS = /[\u0000-\u001f\u007f-\u009f\u200e\u200f\u202a-\u202e\u2066-\u2069]/g

/**
 * The client's file name made safe to show: no folders, no control or bidi characters, trimmed
 * and length-limited (keeping the extension). Only ever displayed, never used as a path.
 */
export function displayName(raw: string | undefined): string {
  const base = (raw ?? '').split(/[\\/]/).pop() ?? ''
  const clean = base.normalize('NFC').replace(UNSAFE_CHARS, '').replace(/\s+/g, ' ').trim()
  if (!clean || /^\.+$/.test(clean)) return 'drawing'
  if (clean.length <= MAX_DISPLAY_NAME) return clean
  const ext = /\.[^.\s]{1,8}$/.exec(clean)?.[0] ?? ''
  return clean.slice(0, MAX_DISPLAY_NAME - ext.length - 1) + '…' + ext
}

/**
 * Multer hands over names as latin1 (busboy's default for multipart headers); browsers send
 * UTF-8, so "Zeichnung-ü.png" arrives as mojibake unless re-decoded.
 */
export function fromMultipartName(name: string): string {
  const utf8 = Buffer.from(name, 'latin1').toString('utf8')
  return utf8.includes('\ufffd') ? name : utf8
}

/** A Content-Disposition value with an ASCII fallback and the UTF-8 name (RFC 6266 / 5987). */
export function contentDisposition(kind: 'inline' | 'attachment', name: string): string {
  const ascii = name.replace(/[^\x20-\x7e]/g, '_').replace(/["\\%;]/g, '_')
  const encoded = encodeURIComponent(name).replace(/['()*]/g, (c) => '%' + c.charCodeAt(0).toString(16).toUpperCase())
  return `${kind}; filename="${ascii}"; filename*=UTF-8''${encoded}`
}
