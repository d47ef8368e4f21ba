/** Builds, their bills of materials, reservations and shortages: what /api/builds answers with. */
import type { BuildStatus, PartKind } from './domain'
import type { CuttingResult } from '../domain/cutting'

/**
 * How a line stands against the stores, shown with our own colours AND a text label:
 * ok — everything still needed is reserved or drawn; caution — not yet reserved but the free
 * stock covers it; short — the free stock does not cover what is still needed.
 */
export type LineAvailability = 'ok' | 'caution' | 'short'

export interface BuildProgressDto {
  lines: number
  /** Lines whose need is covered by reservations and draws. */
  reservedLines: number
  /** Lines drawn in full. */
  drawnLines: number
  /** Lines with a recorded shortage. */
  shortLines: number
  /** Mean over lines of (reserved + drawn) / need, 0–100. */
  reservedPct: number
  /** Mean over lines of drawn / need, 0–100. */
  drawnPct: number
}

export interface BuildSummaryDto {
  id: number
  name: string
  status: BuildStatus
  ownerId: number
  ownerName: string
  targetDate: string | null
  progress: BuildProgressDto
  updatedAt: string
}

export interface BuildLineDto {
  id: number
  buildId: number
  partId: number
  partCode: string
  partName: string
  kind: PartKind
  unit: string
  pressureBearing: boolean
  hazardous: boolean
  /** Count, or for bar lines the finished length of each piece in mm. */
  quantity: number
  /** Bar lines: how many pieces of `quantity` mm; 1 for everything else. */
  pieces: number
  /** True for bar/tube/sheet lines, whose reservations and draws are mm of stock. */
  bar: boolean
  /**
   * What the line takes from stores, in the part's stock unit: quantity for counted and batch
   * parts; for bar lines pieces × (length + 2 × facing + kerf), the stock the cuts consume.
   */
  need: number
  /** Bar lines: stock taken per piece (length + facing at both ends + one saw kerf), mm. */
  stockPerPiece: number | null
  /** Bar lines: pieces cut so far. */
  piecesDrawn: number | null
  note: string
  drawn: number
  reserved: number
  /** Recorded when a partial reservation could not cover the line. */
  shortQuantity: number
  /** need − drawn − reserved: what is neither held nor taken yet. */
  outstanding: number
  onHand: number
  /** Free stock of the part across all builds (on hand − all reservations). */
  available: number
  availability: LineAvailability
  position: number
}

export interface BuildDetailDto extends BuildSummaryDto {
  description: string
  lines: BuildLineDto[]
  /** Whether the signed-in user may change this build (owner, storekeeper or admin). */
  canEdit: boolean
  /** Saw kerf and facing allowance the bar lines are planned with (workshop settings). */
  cutting: { kerfMm: number; facingMm: number }
}

/** Who holds a part: one row per reservation (the part page's panel). */
export interface ReservationDto {
  id: number
  partId: number
  buildId: number
  buildName: string
  buildStatus: BuildStatus
  buildLineId: number
  lineNote: string
  quantity: number
  unit: string
  userName: string
  createdAt: string
}

/** What reserving answered: per line, what was granted and what is recorded short. */
export interface ReserveResultDto {
  lines: { lineId: number; partCode: string; requested: number; granted: number; shortQuantity: number }[]
  build: BuildDetailDto
}

/** The reservations a status change to finished or shelved would release. */
export interface ReleasePreviewDto {
  buildId: number
  lines: { lineId: number; partId: number; partCode: string; partName: string; quantity: number; unit: string }[]
}

/** One line short of stock on an open build (planned or active). */
export interface ShortageDto {
  partId: number
  partCode: string
  partName: string
  unit: string
  buildId: number
  buildName: string
  lineId: number
  shortQuantity: number
  available: number
}

/** The cutting plan for a bar line: stock ids are lot ids, labelled with their bins. */
export interface CuttingPlanDto {
  lineId: number
  partId: number
  partCode: string
  partName: string
  kerfMm: number
  facingMm: number
  /** Pieces the plan cuts (those not cut yet). */
  piecesToCut: number
  lots: { lotId: number; binCode: string; lengthMm: number }[]
  result: CuttingResult
}

/** One row of a BOM import (CSV or pasted text), resolved against the catalogue. */
export interface BomImportRowDto {
  line: number
  code: string
  partId: number | null
  partName: string | null
  quantity: number
  pieces: number
  note: string
  error: string | null
}

export interface BomImportResultDto {
  dryRun: boolean
  rows: BomImportRowDto[]
  added: number
  applied: boolean
}

export interface CopyLinesResultDto {
  copied: number
  /** Codes of archived parts whose lines were not copied. */
  skipped: string[]
  build: BuildDetailDto
}
