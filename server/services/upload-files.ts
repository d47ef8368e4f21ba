import { fileTypeFromBuffer } from 'file-type'
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
