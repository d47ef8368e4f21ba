/**
 * Label sheets as data, and the arithmetic that places labels on them (all lengths in mm).
 * Sheets are named by paper, grid and label size — the measurements a storekeeper can check
 * with a rule on the sheet in hand — never by a label maker's product code.
 */

export const PAPERS = {
  /** ISO 216 A4. */
  A4: { name: 'A4', widthMm: 210, heightMm: 297 },
  /** ANSI Letter, 8½ × 11 in. */
  Letter: { name: 'US Letter', widthMm: 215.9, heightMm: 279.4 },
} as const
export type PaperId = keyof typeof PAPERS
export const PAPER_IDS = Object.keys(PAPERS) as PaperId[]

export interface SheetLayout {
  /** Stable id of a preset ("a4-3x8-70x37"), or "custom". */
  id: string
  /** What the user sees: "A4 · 3 × 8 · 70 × 37 mm". */
  name: string
  paper: PaperId
  columns: number
  rows: number
  labelWidthMm: number
  labelHeightMm: number
  /** From the top and left paper edges to the first label. */
  marginTopMm: number
  marginLeftMm: number
  /** Blank space between neighbouring labels across (X) and down (Y). */
  gapXMm: number
  gapYMm: number
}

export type SheetGrid = Omit<SheetLayout, 'id' | 'name'>

const INCH = 25.4

/** "A4 · 3 × 8 · 70 × 37 mm": paper, grid (columns × rows), label size. */
export function sheetName(g: SheetGrid): string {
  const mm = (n: number) => String(Math.round(n * 10) / 10)
  return `${PAPERS[g.paper].name} · ${g.columns} × ${g.rows} · ${mm(g.labelWidthMm)} × ${mm(g.labelHeightMm)} mm`
}

const preset = (id: string, g: SheetGrid): SheetLayout => ({ id, name: sheetName(g), ...g })

/**
 * Common label sheets, measured from the sheets themselves (margins are what is left over, split
 * evenly; inch sheets use ⅛, 3/16, 5/32 and ½ in spacings). [CP: sizes sold by many makers]
 */
export const SHEET_PRESETS: SheetLayout[] = [
  preset('a4-3x8-70x37', { paper: 'A4', columns: 3, rows: 8, labelWidthMm: 70, labelHeightMm: 37, marginTopMm: 0.5, marginLeftMm: 0, gapXMm: 0, gapYMm: 0 }),
  preset('a4-3x7-63.5x38.1', { paper: 'A4', columns: 3, rows: 7, labelWidthMm: 63.5, labelHeightMm: 38.1, marginTopMm: 15.15, marginLeftMm: 7.21, gapXMm: 2.54, gapYMm: 0 }),
  preset('a4-4x10-52.5x29.7', { paper: 'A4', columns: 4, rows: 10, labelWidthMm: 52.5, labelHeightMm: 29.7, marginTopMm: 0, marginLeftMm: 0, gapXMm: 0, gapYMm: 0 }),
  preset('a4-5x13-38.1x21.2', { paper: 'A4', columns: 5, rows: 13, labelWidthMm: 38.1, labelHeightMm: 21.2, marginTopMm: 10.7, marginLeftMm: 4.67, gapXMm: 2.54, gapYMm: 0 }),
  preset('letter-3x10-66.7x25.4', { paper: 'Letter', columns: 3, rows: 10, labelWidthMm: 2.625 * INCH, labelHeightMm: INCH, marginTopMm: INCH / 2, marginLeftMm: (3 / 16) * INCH, gapXMm: INCH / 8, gapYMm: 0 }),
  preset('letter-2x10-101.6x25.4', { paper: 'Letter', columns: 2, rows: 10, labelWidthMm: 4 * INCH, labelHeightMm: INCH, marginTopMm: INCH / 2, marginLeftMm: (5 / 32) * INCH, gapXMm: (3 / 16) * INCH, gapYMm: 0 }),
  preset('letter-2x5-101.6x50.8', { paper: 'Letter', columns: 2, rows: 5, labelWidthMm: 4 * INCH, labelHeightMm: 2 * INCH, marginTopMm: INCH / 2, marginLeftMm: (5 / 32) * INCH, gapXMm: (3 / 16) * INCH, gapYMm: 0 }),
]

export const DEFAULT_SHEET_ID = SHEET_PRESETS[0].id

export const findSheet = (id: string) => SHEET_PRESETS.find((s) => s.id === id)

/** A user's own grid, named the same way as the presets. */
export const customSheet = (g: SheetGrid): SheetLayout => ({ id: 'custom', name: sheetName(g), ...g })

/** Half a tenth of a millimetre: rounding in inch sheets, far below any printer's accuracy. */
const FIT_TOLERANCE_MM = 0.05

/** Why a grid does not fit its paper (empty when it does). */
export function sheetProblems(g: SheetGrid): string[] {
  const paper = PAPERS[g.paper]
  const problems: string[] = []
  const right = g.marginLeftMm + g.columns * g.labelWidthMm + (g.columns - 1) * g.gapXMm
  const bottom = g.marginTopMm + g.rows * g.labelHeightMm + (g.rows - 1) * g.gapYMm
  if (right > paper.widthMm + FIT_TOLERANCE_MM) {
    problems.push(`The labels reach ${round1(right)} mm across; ${paper.name} is ${paper.widthMm} mm wide.`)
  }
  if (bottom > paper.heightMm + FIT_TOLERANCE_MM) {
    problems.push(`The labels reach ${round1(bottom)} mm down; ${paper.name} is ${paper.heightMm} mm tall.`)
  }
  return problems
}

export const labelsPerSheet = (g: SheetGrid) => g.columns * g.rows

/** Pages needed for `count` labels when the first page starts at position `start` (1-based). */
export function pageCount(g: SheetGrid, count: number, start = 1): number {
  if (count <= 0) return 0
  return Math.ceil((start - 1 + count) / labelsPerSheet(g))
}

export interface LabelPlace {
  /** 0-based page. */
  page: number
  /** 1-based position on the sheet, counted across each row, then down. */
  position: number
  column: number
  row: number
  /** Top-left corner of the label from the top-left corner of the paper. */
  xMm: number
  yMm: number
}

/** Top-left corner of the label at a 1-based `position` on a sheet. */
export function positionOf(g: SheetGrid, position: number): Omit<LabelPlace, 'page'> {
  const slot = position - 1
  const column = slot % g.columns
  const row = Math.floor(slot / g.columns)
  return {
    position, column, row,
    xMm: g.marginLeftMm + column * (g.labelWidthMm + g.gapXMm),
    yMm: g.marginTopMm + row * (g.labelHeightMm + g.gapYMm),
  }
}

/**
 * Where each of `count` labels goes when the sheet in the printer is partly used and the first
 * free position is `start`: the first page begins there, every later page at position 1.
 */
export function labelPlaces(g: SheetGrid, count: number, start = 1): LabelPlace[] {
  const perSheet = labelsPerSheet(g)
  if (!Number.isInteger(start) || start < 1 || start > perSheet) {
    throw new RangeError(`The first free position must be 1–${perSheet}, got ${start}`)
  }
  const places: LabelPlace[] = []
  for (let i = 0; i < count; i++) {
    const slot = start - 1 + i
    places.push({ page: Math.floor(slot / perSheet), ...positionOf(g, (slot % perSheet) + 1) })
  }
  return places
}

const round1 = (n: number) => Math.round(n * 10) / 10
