import PDFDocument from 'pdfkit'
import { readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { dirname, join } from 'node:path'

/**
 * Noto Sans from @fontsource (shipped with the app): pdfkit embeds the .woff subsets; it cannot
 * read .woff2. Read once per process.
 */
let fonts: { regular: Buffer; bold: Buffer } | undefined
function notoSans() {
  if (!fonts) {
    const dir = join(dirname(createRequire(import.meta.url).resolve('@fontsource/noto-sans/package.json')), 'files')
    fonts = {
      regular: readFileSync(join(dir, 'noto-sans-latin-400-normal.woff')),
      bold: readFileSync(join(dir, 'noto-sans-latin-700-normal.woff')),
    }
  }
  return fonts
}

/**
 * A pdfkit document with Noto Sans registered under the caller's font names, and the finished
 * PDF's bytes, which resolve once the caller has called `doc.end()`.
 */
export function notoSansPdf(options: PDFKit.PDFDocumentOptions, names: { regular: string; bold: string }) {
  const doc = new PDFDocument(options)
  const { regular, bold } = notoSans()
  doc.registerFont(names.regular, regular)
  doc.registerFont(names.bold, bold)
  const chunks: Buffer[] = []
  doc.on('data', (c: Buffer) => chunks.push(c))
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)))
    doc.on('error', reject)
  })
  return { doc, done }
}
