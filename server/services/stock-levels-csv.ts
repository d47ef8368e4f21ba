import Papa from 'papaparse'
import { In, IsNull, type EntityManager } from 'typeorm'
import { Bin, Part, StockLot } from '../entities'
import { db, inTransaction } from '../db'
import { badRequest } from '../errors'
import { readCsv } from './parts-csv'
import { countBin, type CountLine } from './stock-count'
import { csvImportRequest, STOCK_CSV_COLUMNS, type CsvImportRequest } from '../../shared/schemas/part-csv'
import { MAX_QUANTITY } from '../../shared/schemas/stock'
import { stockModeOf } from '../../shared/types/domain'
import type { CsvImportResult, CsvRowError } from '../../shared/types/part'

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/
const REASON = 'Stock levels imported from CSV'

/** GET /api/stock-levels/export.csv: one row per lot holding stock (a bin's count, a bar piece, a batch). */
export async function exportStockLevelsCsv(): Promise<string> {
  const lots = await db().getRepository(StockLot).createQueryBuilder('l')
    .innerJoin(Part, 'p', 'p.id = l.partId').innerJoin(Bin, 'b', 'b.id = l.binId')
    // select(column, alias) quotes each alias, so camelCase names survive on PostgreSQL too.
    .select('p.code', 'partCode').addSelect('p.name', 'partName').addSelect('p.kind', 'kind').addSelect('p.unit', 'unit')
    .addSelect('b.code', 'binCode').addSelect('l.id', 'lotId').addSelect('l.quantity', 'quantity')
    .addSelect('l.batchCode', 'batchCode').addSelect('l.expiresOn', 'expiresOn')
    .where('l.quantity > 0').orderBy('p.code').addOrderBy('b.code').addOrderBy('l.id').getRawMany()
  return Papa.unparse({ fields: [...STOCK_CSV_COLUMNS], data: lots.map((l) => STOCK_CSV_COLUMNS.map((c) => l[c] ?? '')) },
    { escapeFormulae: true, newline: '\r\n' })
}

interface Planned { binId: number; line: CountLine; isNew: boolean }

/** Checks each row: the part, the bin, the quantity, the lot or batch it counts. Writes nothing. */
async function plan(tx: EntityManager, text: string) {
  const { rows, errors, fields } = readCsv(text)
  for (const needed of ['partCode', 'binCode', 'quantity']) {
    if (!fields.includes(needed)) errors.push({ line: 1, column: needed, message: `the header has no "${needed}" column` })
  }
  const planned: Planned[] = []
  if (errors.some((e) => e.line === 1)) return { planned, errors, rows: rows.length }
  const cells = rows.map(({ row }) => row)
  const parts = new Map((await tx.findBy(Part, { code: In(cells.map((r) => (r.partCode ?? '').trim().toUpperCase())) })).map((p) => [p.code, p]))
  const bins = new Map((await tx.findBy(Bin, { code: In(cells.map((r) => (r.binCode ?? '').trim().toUpperCase())) })).map((b) => [b.code, b]))
  const seen = new Map<string, number>()
  for (const { row, line } of rows) {
    const fail = (column: string, message: string) => errors.push({ line, column, message })
    const part = parts.get((row.partCode ?? '').trim().toUpperCase())
    const bin = bins.get((row.binCode ?? '').trim().toUpperCase())
    const quantity = Number((row.quantity ?? '').trim())
    const before = errors.length
    if (!part) fail('partCode', `no part has the code "${row.partCode ?? ''}"`)
    else if (part.archived) fail('partCode', `${part.code} is archived; restore it first`)
    if (!bin) fail('binCode', `no bin has the code "${row.binCode ?? ''}"`)
    else if (bin.retired) fail('binCode', `bin ${bin.code} is retired`)
    if ((row.quantity ?? '').trim() === '' || !Number.isFinite(quantity) || quantity < 0 || quantity > MAX_QUANTITY) {
      fail('quantity', `"${row.quantity ?? ''}" is not a quantity from 0 to ${MAX_QUANTITY}`)
    } else if (part && stockModeOf(part.kind) === 'count' && !Number.isInteger(quantity)) {
      fail('quantity', `${part.code} is counted in whole items`)
    }
    if (errors.length > before || !part || !bin) continue
    const line1 = await countLine(tx, part, bin, row, quantity, fail)
    if (!line1) continue
    const key = line1.line.lotId ? `lot ${line1.line.lotId}` : `${part.id}@${bin.id}@${line1.line.batchCode ?? ''}`
    if (seen.has(key) && (line1.line.lotId || stockModeOf(part.kind) !== 'length')) {
      fail('lotId', `line ${seen.get(key)} already counts this stock`)
      continue
    }
    seen.set(key, line)
    planned.push({ binId: bin.id, ...line1 })
  }
  return { planned, errors, rows: rows.length }
}

/** The count line a row stands for: an existing lot, the bin's counted stock, a batch or a new bar piece. */
async function countLine(tx: EntityManager, part: Part, bin: Bin, row: Partial<Record<string, string>>, counted: number,
  fail: (column: string, message: string) => void): Promise<Omit<Planned, 'binId'> | undefined> {
  const lotId = (row.lotId ?? '').trim()
  if (lotId) {
    const lot = await tx.findOneBy(StockLot, { id: Number(lotId) })
    if (!lot || lot.partId !== part.id || lot.binId !== bin.id) return void fail('lotId', `lot ${lotId} is not ${part.code} in ${bin.code}`)
    return { line: { lotId: lot.id, partId: part.id, counted }, isNew: false }
  }
  const mode = stockModeOf(part.kind)
  if (mode === 'count') {
    const lot = await tx.findOneBy(StockLot, { partId: part.id, binId: bin.id, batchCode: IsNull() })
    return { line: { partId: part.id, counted }, isNew: !lot }
  }
  const batchCode = (row.batchCode ?? '').trim()
  const expiresOn = (row.expiresOn ?? '').trim()
  if (mode === 'batch' && !batchCode) return void fail('batchCode', `${part.code} is kept by batch: give the batch code`)
  if (mode === 'batch' && !ISO_DATE.test(expiresOn)) return void fail('expiresOn', 'give the expiry date as YYYY-MM-DD')
  if (counted === 0) return void fail('quantity', 'a new bar piece or batch needs a quantity above 0')
  return { line: { partId: part.id, counted, ...(mode === 'batch' ? { batchCode, expiresOn } : {}) }, isNew: true }
}

/**
 * POST /api/stock-levels/import: each row sets what a lot holds, as a stock-take ('count'
 * movements for the differences). Dry run lists errors by line and column; applying is one
 * transaction, all rows or none.
 */
export async function importStockLevelsCsv(raw: CsvImportRequest, userId: number): Promise<CsvImportResult> {
  const { csv, dryRun } = csvImportRequest.parse(raw)
  const result = (planned: Planned[], errors: CsvRowError[], rows: number, applied: boolean): CsvImportResult => ({
    dryRun, rows, applied, errors: errors.sort((a, b) => a.line - b.line),
    created: planned.filter((p) => p.isNew).length, updated: planned.filter((p) => !p.isNew).length,
  })
  if (dryRun) {
    const { planned, errors, rows } = await plan(db().manager, csv)
    return result(planned, errors, rows, false)
  }
  return inTransaction(async (tx) => {
    const { planned, errors, rows } = await plan(tx, csv)
    if (errors.length) throw badRequest('CSV_INVALID', `${errors.length} problem(s) in the file; nothing was changed.`, { errors })
    const byBin = new Map<number, CountLine[]>()
    for (const p of planned) byBin.set(p.binId, [...(byBin.get(p.binId) ?? []), p.line])
    for (const [binId, lines] of byBin) await countBin(tx, { binId, lines, userId, reason: REASON })
    return result(planned, errors, rows, true)
  })
}
