/** Places, stock and ledger DTOs: what /api/bins, /api/stock and /api/movements answer with. */
import type { MovementKind, PartKind } from './domain'

export interface BinDto {
  id: number
  /** Human code printed large on the label, e.g. "A3-07". */
  code: string
  /** Code the QR label carries; unchanged by renames. */
  labelCode: string
  description: string
  rackId: number
  rackCode: string
  rackName: string
  workshopId: number
  workshopName: string
  retired: boolean
}

/** One lot in a bin: a counted quantity, one bar piece (mm) or one batch. */
export interface BinLineDto {
  lotId: number
  partId: number
  partCode: string
  partName: string
  kind: PartKind
  unit: string
  quantity: number
  /** Part-level: Σ reservations of the part over all bins (reservations are not per bin). */
  reserved: number
  batchCode: string | null
  expiresOn: string | null
  expired: boolean
  pressureBearing: boolean
  hazardous: boolean
}

export interface BinContentsDto {
  bin: BinDto
  lines: BinLineDto[]
}

/** GET /api/bins: the place tree, workshop → rack → bin, with how many lots hold stock. */
export interface BinNodeDto extends BinDto {
  /** Lots with stock in the bin (an empty bin has 0 and may be retired). */
  lots: number
}
export interface RackNodeDto {
  id: number
  code: string
  name: string
  workshopId: number
  bins: BinNodeDto[]
}
export interface WorkshopNodeDto {
  id: number
  name: string
  racks: RackNodeDto[]
}
export interface RackDto {
  id: number
  code: string
  name: string
  workshopId: number
}
export interface WorkshopDto {
  id: number
  name: string
}

export interface PlaceTreeDto {
  workshops: WorkshopNodeDto[]
}

export interface MovementDto {
  id: number
  kind: MovementKind
  /** ISO timestamp. */
  at: string
  partId: number
  partCode: string
  partName: string
  quantity: number
  unit: string
  fromLotId: number | null
  toLotId: number | null
  fromBinCode: string | null
  toBinCode: string | null
  batchCode: string | null
  buildId: number | null
  buildName: string | null
  purchaseOrderId: number | null
  userId: number
  userName: string
  reason: string
  /** The movement this one undoes. */
  reversesId: number | null
  /** The movement that undid this one, if any (a movement is reversed at most once). */
  reversedById: number | null
}

/** What every POST /api/stock/* answers with: the ledger rows it wrote (none for an exact count). */
export interface StockResultDto {
  movements: MovementDto[]
}
