import type { ThreadSpec } from './thread-data'

/** Trims float noise: 0.35000000000000003 → "0.35". */
export const formatNumber = (x: number) => String(Number(x.toFixed(4)))

/** How the thread is written on a drawing: `7BA`, `M3`, `M8x1`, `1/4-20 UNC`, `5/32-40 ME`, `1/4 BSW`. */
export function designationOf(t: ThreadSpec): string {
  switch (t.series) {
    case 'BA':
      return `${t.size}BA`
    case 'M':
      return `M${t.size}`
    case 'MF':
      return `M${t.size}x${formatNumber(t.pitchMm)}`
    case 'BSW':
    case 'BSF':
      return `${t.size} ${t.series}`
    default:
      return `${t.size}-${t.tpi} ${t.series}`
  }
}

/**
 * The stable search key of a thread: upper-case series letters, no spaces, pitch always given.
 *   BA:      `7BA`
 *   metric:  `M3x0.5`, `M8x1` (coarse and fine alike: `M` + size + `x` + pitch in mm)
 *   inch:    `1/4-20UNC`, `#10-32UNF`, `5/32-40ME`, `1/4-20BSW`, `1/4-26BSF` (size-tpi + series)
 * Two designations that mean the same thread always give the same key. Do not change the format
 * without re-indexing every fastener that stores it.
 */
export function keyOf(t: ThreadSpec): string {
  if (t.series === 'BA') return `${t.size}BA`
  if (t.series === 'M' || t.series === 'MF') return `M${t.size}x${formatNumber(t.pitchMm)}`
  return `${t.size}-${t.tpi}${t.series}`
}
