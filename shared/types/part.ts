/** Parts catalogue DTOs: what /api/parts answers with and what other features reuse. */
import type { PartKind } from './domain'

/** One row of the parts list (and of the part picker). */
export interface PartSummaryDto {
  id: number
  code: string
  name: string
  kind: PartKind
  /** Fastener type (stud, nut …) or stock section (round, hex …). */
  form: string | null
  /** Normalised thread key (shared/domain/threads keyOf), e.g. "7BA", "M3x0.5". */
  threadKey: string | null
  material: string | null
  sizeMm: number | null
  lengthMm: number | null
  unit: string
  onHand: number
  reserved: number
  /** on hand − reserved. */
  available: number
  reorderPoint: number
  pressureBearing: boolean
  /** A compound whose safety data sheet names skin/eye hazards (thread-lockers). */
  hazardous: boolean
  archived: boolean
  labelCode: string
}

/** One lot of a part in a bin: a counted quantity, a bar piece (mm) or a batch. */
export interface LotDto {
  id: number
  binId: number
  binCode: string
  quantity: number
  batchCode: string | null
  expiresOn: string | null
  expired: boolean
}

export interface PartDetailDto extends PartSummaryDto {
  attributes: Record<string, unknown>
  notes: string
  tags: string[]
  reorderQuantity: number
  preferredSupplierId: number | null
  unitCost: number
  lots: LotDto[]
  /** True when the ledger has movements for the part (it can then only be archived). */
  hasMovements: boolean
}

/** Structured filters the search understood from the query (shown as chips in the client). */
export type { PartQuery as PartQueryDto } from '../domain/part-query'
import type { PartQuery as PartQueryDto } from '../domain/part-query'

/** A page of search results plus what the query was understood to mean. */
export interface PartSearchPage {
  items: PartSummaryDto[]
  total: number
  page: number
  pageSize: number
  understood: PartQueryDto
}

/** One problem in one CSV row, by line (1 = header) and column name. */
export interface CsvRowError {
  line: number
  column: string
  message: string
}

export interface CsvImportResult {
  dryRun: boolean
  rows: number
  /** Rows that would be (dry run) or were created / updated. */
  created: number
  updated: number
  errors: CsvRowError[]
  applied: boolean
}
