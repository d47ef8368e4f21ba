/**
 * QR sizing for labels: which symbol version a URL needs, how big its modules print, and whether
 * a phone camera will read them.
 */

export const QR_LEVELS = ['L', 'M', 'Q', 'H'] as const
export type QrLevel = (typeof QR_LEVELS)[number]

/**
 * Error correction used on every label: M recovers about 15 % of the symbol (ISO/IEC 18004), enough
 * for a scuffed or oily drawer front, while keeping our ~40–60 character URLs at version 3–4 (29–33
 * modules), so modules stay large on small labels. Q or H would add modules for little gain at
 * the distance a phone is held from a drawer.
 */
export const LABEL_QR_LEVEL: QrLevel = 'M'

/**
 * Smallest module we print: 0.25 mm. Phone cameras at 10–20 cm read laser- or inkjet-printed
 * modules of a quarter millimetre and up reliably. [CP: common practice, not a standard value]
 */
export const MIN_MODULE_MM = 0.25

/**
 * Modules of white kept around the symbol inside its square. ISO/IEC 18004 asks for a quiet zone of
 * 4 modules; the label's own blank padding supplies the rest (checked by quietZoneMm below).
 */
export const QR_MARGIN_MODULES = 2
export const REQUIRED_QUIET_ZONE_MODULES = 4

/**
 * Byte-mode capacity (bytes) of versions 1–10 at each level, from ISO/IEC 18004 table 7
 * [M: from memory; checked in tests against the qrcode package's own encoder].
 */
export const BYTE_CAPACITY: Record<QrLevel, number[]> = {
  L: [17, 32, 53, 78, 106, 134, 154, 192, 230, 271],
  M: [14, 26, 42, 62, 84, 106, 122, 152, 180, 213],
  Q: [11, 20, 32, 46, 60, 74, 86, 108, 130, 151],
  H: [7, 14, 24, 34, 44, 58, 64, 84, 98, 119],
}

/** Smallest version that holds `bytes` in byte mode, or null past version 10 (too long for a label). */
export function qrVersionFor(bytes: number, level: QrLevel = LABEL_QR_LEVEL): number | null {
  const i = BYTE_CAPACITY[level].findIndex((cap) => cap >= bytes)
  return i < 0 ? null : i + 1
}

/** Modules along one side of a version's symbol (ISO/IEC 18004: 17 + 4 × version). */
export const modulesPerSide = (version: number) => 17 + 4 * version

/** UTF-8 length of a string: what byte mode stores. */
export const utf8Length = (s: string) => new TextEncoder().encode(s).length

/**
 * Printed size of one module, and the white kept inside the square, when a symbol of `modules` is
 * drawn in a `sideMm` square that sits `paddingMm` from the label edge. The margin is at least
 * QR_MARGIN_MODULES, and grows when the padding alone cannot make up the 4-module quiet zone.
 */
export function qrModule(sideMm: number, modules: number, paddingMm: number) {
  const small = sideMm / (modules + 2 * QR_MARGIN_MODULES)
  if (QR_MARGIN_MODULES * small + paddingMm >= REQUIRED_QUIET_ZONE_MODULES * small) {
    return { moduleMm: small, marginMm: QR_MARGIN_MODULES * small }
  }
  // Padding + margin = exactly 4 modules: side + 2 × padding = (modules + 8) × module.
  const moduleMm = (sideMm + 2 * paddingMm) / (modules + 2 * REQUIRED_QUIET_ZONE_MODULES)
  return { moduleMm, marginMm: REQUIRED_QUIET_ZONE_MODULES * moduleMm - paddingMm }
}

/** A run of dark modules in one row of a QR symbol: drawn as one rectangle. */
export interface DarkRun { row: number; start: number; length: number }

/**
 * The dark modules of a symbol (`size` × `size`, row by row, as the qrcode package gives them)
 * as horizontal runs: one rectangle per run keeps label files small and the print sharp.
 */
export function darkRuns(size: number, dark: ArrayLike<number | boolean>): DarkRun[] {
  const runs: DarkRun[] = []
  for (let row = 0; row < size; row++) {
    let col = 0
    while (col < size) {
      if (!dark[row * size + col]) { col++; continue }
      const start = col
      while (col < size && dark[row * size + col]) col++
      runs.push({ row, start, length: col - start })
    }
  }
  return runs
}

export interface QrFit {
  version: number | null
  modules: number
  moduleMm: number
  /** White inside the QR square around the symbol. */
  marginMm: number
  /** White from the first dark module to the label edge (margin + label padding). */
  quietZoneMm: number
  scannable: boolean
  problem?: string
}

/**
 * Whether `text` drawn in a `sideMm` square, `paddingMm` from the label edge, prints modules a
 * phone reads (≥ MIN_MODULE_MM). Byte mode is assumed: the encoder may do better by mixing
 * modes, never worse, so this is the worst case.
 */
export function qrFit(text: string, sideMm: number, paddingMm: number, level: QrLevel = LABEL_QR_LEVEL): QrFit {
  const version = qrVersionFor(utf8Length(text), level)
  if (version === null) {
    return { version, modules: 0, moduleMm: 0, marginMm: 0, quietZoneMm: 0, scannable: false, problem: 'The address is too long for a label QR code: shorten the public URL.' }
  }
  const modules = modulesPerSide(version)
  const { moduleMm, marginMm } = qrModule(sideMm, modules, paddingMm)
  const fit: QrFit = { version, modules, moduleMm, marginMm, quietZoneMm: paddingMm + marginMm, scannable: true }
  if (moduleMm < MIN_MODULE_MM - 1e-9) {
    fit.scannable = false
    fit.problem = `The QR modules would print ${moduleMm.toFixed(2)} mm wide; phones need at least ${MIN_MODULE_MM} mm. Choose a larger label.`
  }
  return fit
}
