/**
 * Reads bill-of-materials lines from a CSV file or text pasted from a spreadsheet or a drawing's
 * parts list. Accepted, one line per row:
 *   CSV with a header naming `code` and `quantity` (optional `pieces`, `note`), comma, semicolon
 *   or tab separated; the same columns without a header (code, quantity, note);
 *   or plain text "7BA-NUT 24 cylinder cover nuts".
 * A bar line's quantity may be written "2 x 60" (two pieces of 60 mm) instead of a pieces column.
 */
import Papa from 'papaparse'

export interface BomRow {
  /** 1-based line number in the text (the header is line 1 when there is one). */
  line: number
  code: string
  quantity: number
  pieces: number
  note: string
}
export interface BomRowError {
  line: number
  message: string
}
export interface BomParseResult {
  rows: BomRow[]
  errors: BomRowError[]
}

const HEADER_NAMES = { code: ['code', 'part', 'part code', 'partcode'], quantity: ['quantity', 'qty', 'length', 'length mm'], pieces: ['pieces', 'pcs'], note: ['note', 'notes', 'description', 'for'] }
/** "2 x 60", "2×60 mm", "2*60": pieces × length. */
const PIECES_TIMES_LENGTH = /^(\d+)\s*[x×*]\s*(\d+(?:[.,]\d+)?)\s*(?:mm)?$/i
/** "24", "24 pcs", "12.5 mm", "60,5". */
const PLAIN_NUMBER = /^(\d+(?:[.,]\d+)?)\s*(?:pcs|mm|off)?$/i

type Columns = { code: number; quantity: number; pieces: number; note: number }

function headerColumns(cells: string[]): Columns | null {
  const norm = cells.map((c) => c.trim().toLowerCase())
  const find = (names: string[]) => norm.findIndex((c) => names.includes(c))
  const cols = { code: find(HEADER_NAMES.code), quantity: find(HEADER_NAMES.quantity), pieces: find(HEADER_NAMES.pieces), note: find(HEADER_NAMES.note) }
  return cols.code >= 0 && cols.quantity >= 0 ? cols : null
}

/** Reads "24", "2 x 60" into quantity and pieces; null when it is not a quantity. */
export function readQuantity(raw: string): { quantity: number; pieces: number } | null {
  const s = raw.trim()
  const times = PIECES_TIMES_LENGTH.exec(s)
  if (times) return { pieces: Number(times[1]), quantity: Number(times[2].replace(',', '.')) }
  const plain = PLAIN_NUMBER.exec(s)
  return plain ? { quantity: Number(plain[1].replace(',', '.')), pieces: 1 } : null
}

/** Splits "7BA-NUT 24 cylinder nuts" (a row with no separator) into its cells. */
function splitPlain(line: string): string[] {
  const m = /^(\S+)\s+(\d+\s*[x×*]\s*\d+(?:[.,]\d+)?(?:\s*mm)?|\d+(?:[.,]\d+)?(?:\s*(?:pcs|mm|off))?)(?:\s+(.*))?$/i.exec(line.trim())
  return m ? [m[1], m[2], m[3] ?? ''] : [line.trim()]
}

function toRow(cells: string[], cols: Columns, line: number): BomRow | BomRowError {
  const cell = (i: number) => (i >= 0 ? (cells[i] ?? '').trim() : '')
  const code = cell(cols.code).toUpperCase()
  if (!code) return { line, message: 'the part code is missing' }
  if (!cell(cols.quantity)) return { line, message: `the quantity for ${code} is missing` }
  const q = readQuantity(cell(cols.quantity))
  if (!q || !(q.quantity > 0)) return { line, message: `"${cell(cols.quantity)}" is not a quantity above 0` }
  let pieces = q.pieces
  if (cols.pieces >= 0 && cell(cols.pieces)) {
    pieces = Number(cell(cols.pieces))
    if (!Number.isInteger(pieces) || pieces < 1) return { line, message: `"${cell(cols.pieces)}" is not a whole number of pieces` }
  }
  return { line, code, quantity: q.quantity, pieces, note: cell(cols.note).slice(0, 200) }
}

/** Parses the whole text; blank lines and lines starting with # are skipped. */
export function parseBomText(raw: string): BomParseResult {
  // One kind of line break: papaparse takes the first it meets for the whole text.
  const text = raw.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n')
  const parsed = Papa.parse<string[]>(text, { skipEmptyLines: 'greedy', delimitersToGuess: [',', ';', '\t'] })
  const rows: BomRow[] = []
  const errors: BomRowError[] = []
  // papaparse drops blank lines, so recover each row's line number from the text itself.
  const lineNumbers = text.split('\n').map((l, i) => ({ l: l.trim(), n: i + 1 })).filter((x) => x.l)
  let cols: Columns = { code: 0, quantity: 1, pieces: -1, note: 2 }
  parsed.data.forEach((raw, i) => {
    const line = lineNumbers[i]?.n ?? i + 1
    const cells = raw.length === 1 ? splitPlain(raw[0]) : raw
    if (!cells.join('').trim() || cells[0].trim().startsWith('#')) return
    if (i === 0) {
      const header = headerColumns(cells)
      if (header) { cols = header; return }
    }
    const r = toRow(cells, cols, line)
    if ('code' in r) rows.push(r)
    else errors.push(r)
  })
  return { rows, errors }
}
