/**
 * Bill-of-materials arithmetic shared by the server (reservations, draws) and the client
 * (what a line will take). Pure: no database, no Vue.
 */
import type { LineAvailability } from '../types/build'

/** Quantities are floats (bar lengths in mm); differences below this are rounding, not stock. */
export const BOM_EPSILON = 1e-6

/**
 * Saw kerf the build screens plan bar cuts with until the admin sets the workshop's own
 * [common practice: a small bandsaw cuts 1.3–1.6 mm; reference §7].
 */
export const DEFAULT_BUILD_KERF_MM = 1.5
/** Facing allowance per end [common practice: 0.5–1 mm per end; reference §7]. */
export const DEFAULT_BUILD_FACING_MM = 0.5

export interface CuttingAllowance {
  kerfMm: number
  facingMm: number
}

/** Stock one bar piece takes: its length, facing at both ends, and one saw kerf. */
export const stockPerPiece = (lengthMm: number, c: CuttingAllowance) => lengthMm + 2 * c.facingMm + c.kerfMm

/** The blank sawn off for one piece (finished length plus facing at both ends), mm. */
export const blankLength = (lengthMm: number, c: CuttingAllowance) => lengthMm + 2 * c.facingMm

export interface LineShape {
  quantity: number
  pieces: number
  /** Counted: items; bar: finished mm (pieces cut × length). */
  drawn: number
  bar: boolean
}

/**
 * What a line takes from stores in the part's stock unit: the quantity, or for bar lines
 * pieces × stock per piece. Bar lines count each cut piece at its full allowance, so a line is
 * done when all pieces are cut even where the last cut of a bar needed no kerf.
 */
export function lineNeed(line: LineShape, c: CuttingAllowance): number {
  return line.bar ? line.pieces * stockPerPiece(line.quantity, c) : line.quantity
}

/** Pieces cut so far on a bar line (drawn is kept as finished mm). */
export const piecesDrawn = (line: LineShape) =>
  line.bar ? Math.round(line.drawn / line.quantity) : 0

/** Drawn in the stock unit: items, or for bar lines pieces cut × stock per piece. */
export function drawnStock(line: LineShape, c: CuttingAllowance): number {
  return line.bar ? piecesDrawn(line) * stockPerPiece(line.quantity, c) : line.drawn
}

/** need − drawn − held: what is neither reserved nor taken yet (never below 0). */
export function outstandingOf(line: LineShape, held: number, c: CuttingAllowance): number {
  const rest = lineNeed(line, c) - drawnStock(line, c) - held
  return rest > BOM_EPSILON ? rest : 0
}

/** ok when nothing is outstanding; caution when the free stock covers it; short otherwise. */
export function availabilityOf(outstanding: number, available: number): LineAvailability {
  if (outstanding <= BOM_EPSILON) return 'ok'
  return available + BOM_EPSILON >= outstanding ? 'caution' : 'short'
}

/** The words shown beside the colour, so the state is never told by colour alone. */
export const AVAILABILITY_LABELS: Record<LineAvailability, string> = {
  ok: 'Covered',
  caution: 'In stock, not reserved',
  short: 'Short',
}

export interface ProgressLine {
  need: number
  drawn: number
  reserved: number
  shortQuantity: number
}

/** Per-build progress: line counts and mean percentages (each line weighs the same). */
export function progressOf(lines: ProgressLine[]) {
  const frac = (n: number, d: number) => (d > BOM_EPSILON ? Math.min(1, n / d) : 1)
  const n = lines.length
  const mean = (f: (l: ProgressLine) => number) =>
    n ? Math.round((lines.reduce((s, l) => s + f(l), 0) / n) * 100) : 0
  return {
    lines: n,
    reservedLines: lines.filter((l) => l.drawn + l.reserved + BOM_EPSILON >= l.need).length,
    drawnLines: lines.filter((l) => l.drawn + BOM_EPSILON >= l.need).length,
    shortLines: lines.filter((l) => l.shortQuantity > BOM_EPSILON).length,
    reservedPct: mean((l) => frac(l.drawn + l.reserved, l.need)),
    drawnPct: mean((l) => frac(l.drawn, l.need)),
  }
}

/** One cut a draw makes: which stock piece, where along it, and the stock it takes (blank + kerf). */
export interface PlannedDraw {
  lotId: number
  startMm: number
  endMm: number
  takeMm: number
}

/**
 * Cuts one after another from one piece, as the saw takes them: each the blank, then up to one
 * kerf (a cut at the very end of the bar loses only what is left). Null when they do not fit.
 * Positions agree with the cutting-list planner's layout of the same pieces on the same bar.
 */
export function cutsAlongPiece(lotId: number, lengthMm: number, blankMm: number, kerfMm: number, n: number): PlannedDraw[] | null {
  const cuts: PlannedDraw[] = []
  let at = 0
  for (let i = 0; i < n; i++) {
    const rest = lengthMm - at
    if (rest + BOM_EPSILON < blankMm) return null
    const takeMm = blankMm + Math.min(kerfMm, Math.max(0, rest - blankMm))
    cuts.push({ lotId, startMm: round3(at), endMm: round3(at + blankMm), takeMm })
    at += takeMm
  }
  return cuts
}

const round3 = (x: number) => Number(x.toFixed(3))
