import { z } from 'zod'

/** POST /api/parts/import and /api/stock-levels/import: the CSV text; a dry run unless dryRun is false. */
export const csvImportRequest = z.object({
  csv: z.string().min(1, 'the CSV file is empty'),
  dryRun: z.boolean().default(true),
})
export type CsvImportRequest = z.input<typeof csvImportRequest>

/** Columns of the parts CSV, in export order; import accepts them in any order. */
export const PART_CSV_COLUMNS = [
  'code', 'name', 'kind', 'unit',
  'type', 'thread', 'lengthMm', 'material', 'finish', 'head', 'drive',
  'thicknessMm', 'innerMm', 'outerMm', 'shape', 'section', 'sizeMm', 'wallMm',
  'grade', 'containerSize', 'hazardous', 'properties',
  'notes', 'tags', 'reorderPoint', 'reorderQuantity', 'unitCost', 'pressureBearing', 'archived', 'labelCode',
] as const
export type PartCsvColumn = (typeof PART_CSV_COLUMNS)[number]

/** Columns of the stock-levels CSV: one row per lot (a bin's count, a bar piece, a batch). */
export const STOCK_CSV_COLUMNS = [
  'partCode', 'partName', 'kind', 'unit', 'binCode', 'lotId', 'quantity', 'batchCode', 'expiresOn',
] as const
