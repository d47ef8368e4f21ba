/**
 * Makes the thumbnails of one image per message, off the main thread (see server/services/thumbnails.ts).
 * Plain JavaScript on purpose: a worker thread starts without the tsx or vitest loaders, so a
 * .mjs file loads the same under `npm start`, `tsx` and the test runner.
 *
 * In:  { id, source, mime, outputs: [{ width, path }] }
 * Out: { id, ok: true, width, height, made: [{ width, path, actualWidth }] } | { id, ok: false, error }
 */
import { parentPort } from 'node:worker_threads'
import { readFile, writeFile, rename } from 'node:fs/promises'
import { Jimp } from 'jimp'

/** Largest image decoded: 50 megapixels (a high-end camera); bigger headers are refused before
 *  decoding so a small crafted file cannot ask for gigabytes of bitmap. */
const MAX_PIXELS = 50_000_000
/** JPEG thumbnail quality: 82 is a common web default, sharp enough for pencil lines. */
const JPEG_QUALITY = 82

/** Width and height from the header of a PNG, GIF or JPEG, without decoding it. */
function headerSize(buf, mime) {
  if (mime === 'image/png' && buf.length >= 24) return [buf.readUInt32BE(16), buf.readUInt32BE(20)]
  if (mime === 'image/gif' && buf.length >= 10) return [buf.readUInt16LE(6), buf.readUInt16LE(8)]
  if (mime === 'image/jpeg') {
    let i = 2
    while (i + 9 < buf.length && buf[i] === 0xff) {
      const marker = buf[i + 1]
      const isFrame = marker >= 0xc0 && marker <= 0xcf && ![0xc4, 0xc8, 0xcc].includes(marker)
      if (isFrame) return [buf.readUInt16BE(i + 7), buf.readUInt16BE(i + 5)]
      i += 2 + buf.readUInt16BE(i + 2)
    }
  }
  return undefined
}

async function makeThumbnails({ source, mime, outputs }) {
  const buf = await readFile(source)
  const size = headerSize(buf, mime)
  if (size && size[0] * size[1] > MAX_PIXELS) {
    throw new Error(`The image is ${size[0]}×${size[1]} pixels, more than the ${MAX_PIXELS / 1e6} MP limit.`)
  }
  // fromBuffer honours the EXIF orientation tag itself (jimp 1.6: attemptExifRotate).
  const image = await Jimp.fromBuffer(buf, {
    'image/jpeg': { maxResolutionInMP: MAX_PIXELS / 1e6 },
  })
  const { width, height } = image.bitmap
  const made = []
  // Largest first, shrinking the one bitmap in place: each smaller thumbnail is scaled from the
  // one before it, several times faster than going back to a 12 MP original and alike at these
  // sizes, and no second full-size bitmap is held.
  for (const out of [...outputs].sort((a, b) => b.width - a.width)) {
    // Never upscale: an image narrower than the thumbnail keeps its own width.
    if (image.bitmap.width > out.width) image.resize({ w: out.width })
    const encoded = mime === 'image/jpeg'
      ? await image.getBuffer('image/jpeg', { quality: JPEG_QUALITY })
      : await image.getBuffer('image/png')
    // Write then rename, so a reader never sees half a thumbnail.
    await writeFile(out.path + '.part', encoded)
    await rename(out.path + '.part', out.path)
    made.push({ width: out.width, path: out.path, actualWidth: image.bitmap.width })
  }
  return { width, height, made }
}

parentPort.on('message', async (job) => {
  try {
    const result = await makeThumbnails(job)
    parentPort.postMessage({ id: job.id, ok: true, ...result })
  } catch (err) {
    parentPort.postMessage({ id: job.id, ok: false, error: err instanceof Error ? err.message : String(err) })
  }
})
