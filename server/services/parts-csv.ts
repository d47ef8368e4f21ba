import Papa from 'papaparse'
import type { EntityManager } from 'typeorm'
import { Movement, Part, StockLot } from '../entities'
import { db, inTransaction } from '../db'
import { afterCatalogueWrite } from './part-search-index'
import { badRequest } from '../errors'
import { createPart, updatePart } from './parts'
import { formatProperties, partToInput, rowToPart, type CsvRow } from './part-csv-rows'
import { csvImportRequest, PART_CSV_COLUMNS, type CsvImportRequest } from '../../shared/schemas/part-csv'
import type { PartInputParsed } from '../../shared/schemas/part'
import type { CsvImportResult, CsvRowError } from '../../shared/types/part'

/** Spreadsheet programs run cells starting = + - @ as formulas; papaparse prefixes them with '. */
const UNPARSE = { escapeFormulae: true, newline: '\r\n' } as const

const yesNo = (b: unknown) => (b ? 'yes' : 'no')

/** GET /api/parts/export.csv: every part, one row each, attributes in their own columns. */
export async function exportPartsCsv(includeArchived: boolean): Promise<string> {
  const parts = await db().getRepository(Part).find({ where: includeArchived ? {} : { archived: false }, order: { code: 'ASC' } })
  const rows = parts.map((p) => {
    const a = p.attributes
    return PART_CSV_COLUMNS.map((c) => {
      if (c === 'properties') return formatProperties(a.properties)
      if (c === 'hazardous') return p.kind === 'compound' ? yesNo(a.hazardous) : ''
      if (c === 'tags') return p.tags.join('; ')
      if (c === 'pressureBearing' || c === 'archived') return yesNo(p[c])
      if (c === 'kind') return p.kind
      const own = (p as unknown as Record<string, unknown>)[c]
      const v = c in a ? a[c] : ['code', 'name', 'unit', 'notes', 'reorderPoint', 'reorderQuantity', 'unitCost', 'labelCode'].includes(c) ? own : ''
      return v === null || v === undefined ? '' : String(v)
    })
  })
  return Papa.unparse({ fields: [...PART_CSV_COLUMNS], data: rows }, UNPARSE)
}

/** Parsed CSV rows with their line numbers (header = line 1), blank lines skipped. */
export function readCsv(text: string): { rows: { row: CsvRow; line: number }[]; errors: CsvRowError[]; fields: string[] } {
  const parsed = Papa.parse<CsvRow>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: false, transformHeader: (h) => h.trim() })
  const blank = (row?: CsvRow) => !row || !Object.values(row).some((v) => typeof v === 'string' && v.trim() !== '')
  const errors: CsvRowError[] = parsed.errors
    .filter((e) => !blank(parsed.data[e.row ?? -1]))
    .map((e) => ({ line: (e.row ?? 0) + 2, column: 'row', message: e.message }))
  const rows = parsed.data.map((row, i) => ({ row, line: i + 2 })).filter(({ row }) => !blank(row))
  return { rows, errors, fields: parsed.meta.fields ?? [] }
}

interface Planned { line: number; input: PartInputParsed; existing?: Part }

/** Checks every row against the schema, the thread parser and the catalogue; nothing is written. */
async function plan(tx: EntityManager, text: string): Promise<{ planned: Planned[]; errors: CsvRowError[]; rows: number }> {
  const { rows, errors, fields } = readCsv(text)
  for (const needed of ['name', 'kind']) {
    if (!fields.includes(needed)) errors.push({ line: 1, column: needed, message: `the header has no "${needed}" column` })
  }
  if (errors.some((e) => e.line === 1)) return { planned: [], errors, rows: rows.length }
  const planned: Planned[] = []
  const codes = new Map<string, number>()
  for (const { row, line } of rows) {
    const typedCode = (row.code ?? '').trim().toUpperCase()
    const base = typedCode ? await tx.findOneBy(Part, { code: typedCode }) ?? undefined : undefined
    const r = rowToPart(row, line, base ? partToInput(base) : undefined)
    errors.push(...r.errors)
    if (!r.input) continue
    const code = r.input.code
    if (code && codes.has(code)) {
      errors.push({ line, column: 'code', message: `${code} is also on line ${codes.get(code)}` })
      continue
    }
    if (code) codes.set(code, line)
    const existing = base
    if (existing && existing.kind !== r.input.attributes.kind && await hasStock(tx, existing.id)) {
      errors.push({ line, column: 'kind', message: `${code} has stock or movements, so its kind (${existing.kind}) cannot change` })
      continue
    }
    planned.push({ line, input: r.input, existing })
  }
  return { planned, errors, rows: rows.length }
}

const hasStock = async (tx: EntityManager, partId: number) =>
  await tx.existsBy(Movement, { partId }) || await tx.existsBy(StockLot, { partId })

/**
 * POST /api/parts/import: a dry run lists every row's errors by line and column; applying
 * writes every row in one transaction, or nothing when any row is wrong.
 */
export async function importPartsCsv(raw: CsvImportRequest): Promise<CsvImportResult> {
  const { csv, dryRun } = csvImportRequest.parse(raw)
  if (dryRun) {
    const { planned, errors, rows } = await plan(db().manager, csv)
    return summary(true, rows, planned, errors, false)
  }
  return afterCatalogueWrite([], (written) => inTransaction(async (tx) => {
    const { planned, errors, rows } = await plan(tx, csv)
    if (errors.length) {
      throw badRequest('CSV_INVALID', `${errors.length} problem(s) in the file; nothing was imported.`, { errors })
    }
    for (const p of planned) {
      // plan() refused kind changes of stocked parts
      const part = p.existing ? await updatePart(tx, p.existing, p.input, { kindLocked: false }) : await createPart(tx, p.input)
      written.push(part.id)
    }
    return summary(false, rows, planned, errors, true)
  }))
}

const summary = (dryRun: boolean, rows: number, planned: Planned[], errors: CsvRowError[], applied: boolean): CsvImportResult => ({
  dryRun, rows, applied, errors: errors.sort((a, b) => a.line - b.line),
  created: planned.filter((p) => !p.existing).length,
  updated: planned.filter((p) => p.existing).length,
})
