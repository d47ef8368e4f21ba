/** Turns one parts-CSV row into a part input, or into errors by column. */
import { ZodError } from 'zod'
import { parseThread } from '../../shared/domain/threads'
import { partInput, type PartInput, type PartInputParsed } from '../../shared/schemas/part'
import type { PartCsvColumn } from '../../shared/schemas/part-csv'
import type { CsvRowError } from '../../shared/types/part'
import type { Part } from '../entities'

export type CsvRow = Partial<Record<string, string>>

const NUMBER_COLUMNS = ['lengthMm', 'thicknessMm', 'innerMm', 'outerMm', 'sizeMm', 'wallMm', 'reorderPoint', 'reorderQuantity', 'unitCost'] as const
const YES = ['yes', 'y', 'true', '1']
const NO = ['no', 'n', 'false', '0', '']
/** Attribute columns of each kind (the rest of the row is common to every part). */
const KIND_COLUMNS: Record<string, PartCsvColumn[]> = {
  fastener: ['type', 'thread', 'lengthMm', 'material', 'finish', 'head', 'drive'],
  gasket: ['material', 'thicknessMm', 'innerMm', 'outerMm', 'shape'],
  stock: ['material', 'section', 'sizeMm', 'thicknessMm', 'wallMm'],
  compound: ['grade', 'containerSize', 'hazardous'],
  other: ['properties'],
}
/** A spreadsheet-escaped cell ("'=…", see papaparse escapeFormulae) read back as typed. */
const unescape = (v: string) => v.replace(/^'(?=[=+\-@\t\r])/, '')

export interface RowResult {
  input?: PartInputParsed
  errors: CsvRowError[]
}

/** Reads "key=value; key=value" free attributes of an 'other' part. */
const properties = (v: string) =>
  Object.fromEntries(v.split(';').map((kv) => kv.split('=').map((s) => s.trim())).filter(([k]) => k).map(([k, ...rest]) => [k, rest.join('=')]))

export const formatProperties = (p: unknown) =>
  Object.entries((p ?? {}) as Record<string, string>).map(([k, v]) => `${k}=${v}`).join('; ')

/** An existing part as an input, so that blank cells keep what it has (e.g. its preferred supplier). */
export const partToInput = (p: Part): Record<string, unknown> => ({
  code: p.code, name: p.name, unit: p.unit, notes: p.notes, tags: p.tags, reorderPoint: p.reorderPoint,
  reorderQuantity: p.reorderQuantity, preferredSupplierId: p.preferredSupplierId, unitCost: p.unitCost,
  pressureBearing: p.pressureBearing, attributes: p.attributes,
})

/**
 * One row → a checked part input; `line` is the row's line in the file (the header is line 1).
 * With `base` (the part the row's code names) blank cells keep the part's current values.
 */
export function rowToPart(row: CsvRow, line: number, base: Record<string, unknown> = {}): RowResult {
  const errors: CsvRowError[] = []
  const cell = (c: string) => unescape((row[c] ?? '').trim())
  const fail = (column: string, message: string) => errors.push({ line, column, message })
  const value = (c: PartCsvColumn): unknown => {
    const v = cell(c)
    if ((NUMBER_COLUMNS as readonly string[]).includes(c)) {
      if (v === '') return undefined
      const n = Number(v)
      if (!Number.isFinite(n)) fail(c, `"${v}" is not a number`)
      return n
    }
    if (c === 'hazardous' || c === 'pressureBearing') {
      if (YES.includes(v.toLowerCase())) return true
      if (NO.includes(v.toLowerCase())) return false
      fail(c, `"${v}" should be yes or no`)
      return undefined
    }
    if (c === 'properties') return properties(v)
    return v === '' ? undefined : v
  }
  const kind = cell('kind').toLowerCase()
  const baseAttributes = (base.attributes ?? {}) as Record<string, unknown>
  const attributes: Record<string, unknown> = baseAttributes.kind === kind ? { ...baseAttributes } : { kind }
  for (const c of KIND_COLUMNS[kind] ?? []) {
    const v = value(c)
    if (v !== undefined) attributes[c] = v
  }
  const raw: Record<string, unknown> = { ...base, attributes }
  for (const c of ['code', 'name', 'unit', 'notes', 'reorderPoint', 'reorderQuantity', 'unitCost', 'pressureBearing'] as const) {
    const v = value(c)
    if (v !== undefined) raw[c] = v
  }
  const tags = cell('tags')
  if (tags) raw.tags = tags.split(/[;|]/).map((t) => t.trim()).filter(Boolean)
  if (errors.length) return { errors }
  return checkRow(raw as PartInput, attributes, line)
}

function checkRow(raw: PartInput, attributes: Record<string, unknown>, line: number): RowResult {
  const parsed = partInput.safeParse(raw)
  if (!parsed.success) return { errors: zodErrors(parsed.error, line) }
  if (attributes.kind === 'fastener') {
    const t = parseThread(String(attributes.thread))
    if (!t.ok) return { errors: [{ line, column: 'thread', message: t.message }] }
  }
  return { input: parsed.data, errors: [] }
}

/** Zod issues named by CSV column: attributes.thread → thread, tags.2 → tags. */
function zodErrors(err: ZodError, line: number): CsvRowError[] {
  return err.issues.map((i) => {
    const path = i.path.map(String)
    const column = path[0] === 'attributes' ? (path[1] ?? 'kind') : (path[0] ?? 'row')
    const message = column === 'kind' && i.code === 'invalid_union'
      ? 'kind must be fastener, gasket, stock, compound or other'
      : i.message
    return { line, column, message }
  })
}
