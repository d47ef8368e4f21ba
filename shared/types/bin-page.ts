/** The bin page's own DTOs: build lines a user may draw from a bin, and stock-take results. */
import type { BuildStatus } from './domain'
import type { MovementDto } from './stock'

/** An open build line that needs a part held in the bin; lines with a reservation come first. */
export interface DrawLineDto {
  buildId: number
  buildName: string
  buildStatus: BuildStatus
  mine: boolean
  lineId: number
  partId: number
  note: string
  unit: string
  /** Bar lines are drawn in pieces (the cutting plan chooses the cut); others in items or containers. */
  bar: boolean
  /** What is still to draw: items/containers, or pieces for bar lines. */
  open: number
  /** Held for this line now (stock units). */
  reserved: number
}

/** A difference the stock-take found that moved on since the bin was counted. */
export interface StaleCountDto {
  binId: number
  binCode: string
  lotId: number
  partCode: string
  expected: number
  now: number
}

export interface StockTakeResultDto {
  bins: number
  movements: MovementDto[]
}
