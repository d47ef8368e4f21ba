import { describe, expect, it } from 'vitest'
import {
  MAX_DISPLAY_NAME, contentDisposition, displayName, fromMultipartName, judgeFileType, newStoredName, thumbName,
} from '../../../server/services/upload-files'
import { WEBP_1X1, gifBytes, jpegBytes, pdfBytes, pngBytes } from '../../helpers/images'


describe('judgeFileType', () => {
  it('reads PNG, JPEG, GIF, WebP and PDF from their bytes', async () => {
    expect(await judgeFileType(await pngBytes(8, 8))).toBe('image/png')
    expect(await judgeFileType(await jpegBytes(8, 8))).toBe('image/jpeg')
    expect(await judgeFileType(await gifBytes(8, 8))).toBe('image/gif')
    expect(await judgeFileType(WEBP_1X1)).toBe('image/webp')
    expect(await judgeFileType(await pdfBytes())).toBe('application/pdf')
  })

  it('refuses a ZIP (a recognised but unaccepted type) with 415 naming it', async () => {
    const zip = Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(60)])
    await expect(judgeFileType(zip)).rejects.toMatchObject({ status: 415, details: { detected: 'application/zip' } })
  })
})

describe('stored and thumbnail names', () => {
  it('are random hex with the judged extension, and thumbnails follow the type', () => {
    const a = newStoredName('image/jpeg')
    expect(a).toMatch(/^[0-9a-f]{32}\.jpg$/)
    expect(newStoredName('image/jpeg')).not.toBe(a)
    expect(thumbName('abc.jpg', 'image/jpeg', 160)).toBe('abc-160.jpg')
    expect(thumbName('abc.gif', 'image/gif', 800)).toBe('abc-800.png')
  })
})

describe('displayName', () => {
  it('drops folders (both slash kinds), control and bidi characters', () => {
    expect(displayName('C:\\Users\\al\\valve gear.png')).toBe('valve gear.png')
    expect(displayName('../../x/\u0007cyl\u202Egpj.exe')).toBe('cylgpj.exe')
    expect(displayName('  spaced \t  out .pdf ')).toBe('spaced out .pdf')
  })

  it('gives blank or dot-only names a neutral one', () => {
    expect(displayName('')).toBe('drawing')
    expect(displayName(undefined)).toBe('drawing')
    expect(displayName('..')).toBe('drawing')
  })

  it(`cuts long names to ${MAX_DISPLAY_NAME} characters, keeping the extension`, () => {
    const name = displayName('a'.repeat(300) + '.pdf')
    expect(name).toHaveLength(MAX_DISPLAY_NAME)
    expect(name.endsWith('….pdf')).toBe(true)
  })
})

describe('fromMultipartName and contentDisposition', () => {
  it('re-reads UTF-8 names that arrived as latin1, and leaves true latin1 alone', () => {
    expect(fromMultipartName(Buffer.from('Zylinderdeckel ü.png', 'utf8').toString('latin1'))).toBe('Zylinderdeckel ü.png')
    expect(fromMultipartName('caf\u00e9.png')).toBe('caf\u00e9.png')
  })

  it('gives an ASCII fallback and the exact UTF-8 name (RFC 6266)', () => {
    expect(contentDisposition('attachment', 'Kessel "A"; ü.pdf'))
      .toBe(`attachment; filename="Kessel _A__ _.pdf"; filename*=UTF-8''Kessel%20%22A%22%3B%20%C3%BC.pdf`)
  })
})
