/** Labels and scanning DTOs: what /api/labels and /api/scan answer with. */
import type { CautionKind } from '../domain/cautions'

export type LabelTarget = 'bin' | 'part'

/** One label's content: the QR URL and the lines printed beside it. */
export interface LabelItemDto {
  kind: LabelTarget
  id: number
  /** Human code printed large: bin "A1-03" or part code "7BA-STUD-12-BRA". */
  code: string
  labelCode: string
  /** Absolute URL the QR code carries: <public URL>/bins/<label code> or /parts/by-label/<label code>. */
  url: string
  /** Part name (a bin with one part), the bin's description, or "3 parts". */
  name: string
  /** Thread and length, section and size, thickness or container size. */
  detail: string
  cautions: CautionKind[]
}

export interface LabelItemsDto {
  items: LabelItemDto[]
  /** Codes of the list that matched nothing (the rest are still returned). */
  unknownCodes: string[]
}

/** GET /api/scan/resolve: where a scanned or typed code leads. */
export interface ScanResultDto {
  type: LabelTarget
  id: number
  /** Bin code or part code. */
  code: string
  name: string
  /** Client route to open, e.g. "/bins/A1-03" or "/parts/12". */
  path: string
}
