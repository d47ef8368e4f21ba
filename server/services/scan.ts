import { db } from '../db'
import { Bin, Part } from '../entities'
import { AppError } from '../errors'
import type { ScanResultDto } from '../../shared/types/labels'

/** Paths our labels carry: /bins/<code> and /parts/by-label/<label code>. */
const LABEL_PATH = /^\/bins\/([^/]+)\/?$|^\/parts\/by-label\/([^/]+)\/?$/i

const notOurs = (code: string) =>
  new AppError(404, 'NOT_OUR_LABEL', `“${code.length > 60 ? code.slice(0, 57) + '…' : code}” is not one of our labels.`)

/**
 * Where a scanned or typed code leads. Accepts a whole label URL (any host: labels printed before
 * the public address changed still work), a bin code or bin label code, a part label code or a
 * part code; case does not matter.
 */
export async function resolveScan(raw: string): Promise<ScanResultDto> {
  const text = raw.trim()
  let code = text
  let only: 'bin' | 'part' | undefined
  if (/^[a-z][a-z0-9+.-]*:\/\//i.test(text) || text.startsWith('/')) {
    const match = LABEL_PATH.exec(safePath(text))
    if (!match) throw notOurs(text)
    code = decodeURIComponent(match[1] ?? match[2])
    only = match[1] ? 'bin' : 'part'
  }
  const key = code.toUpperCase()
  const m = db().manager
  if (only !== 'part') {
    const bin = await m.findOne(Bin, { where: [{ code: key }, { labelCode: key }] })
    if (bin) return { type: 'bin', id: bin.id, code: bin.code, name: bin.description, path: `/bins/${encodeURIComponent(bin.code)}` }
  }
  if (only !== 'bin') {
    const where = only === 'part' ? [{ labelCode: key }] : [{ labelCode: key }, { code: key }]
    const part = await m.findOne(Part, { where })
    if (part) return { type: 'part', id: part.id, code: part.code, name: part.name, path: `/parts/${part.id}` }
  }
  throw notOurs(text)
}

function safePath(text: string): string {
  try {
    return new URL(text, 'http://label.invalid').pathname
  } catch {
    return ''
  }
}
