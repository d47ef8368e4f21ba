/** Counting small parts by weighing them: N = (gross − tare) / (sample mass / sample count). */

export interface CountByWeightInput {
  sampleCount: number
  sampleWeightG: number
  /** Gross weight of the whole lot, container included. */
  totalWeightG: number
  /** Weight of the empty container; 0 when the scale was zeroed with it on. */
  tareG?: number
  /** Smallest step the scale shows (readability). */
  scaleResolutionG: number
}

export interface CountByWeightResult {
  /** Best estimate, rounded to whole pieces. Show it as "≈". */
  count: number
  /** Range the true count lies in when each reading may be off by one scale step. */
  low: number
  high: number
  pieceWeightG: number
  netWeightG: number
  /** Half the range as a fraction of the count. */
  relativeError: number
  warnings: string[]
}

/** Weigh at least this many pieces for the sample [common practice: 25–50]. */
export const MIN_SAMPLE_COUNT = 25
/** The sample should weigh at least this many scale steps [common practice: ≥ 100× readability]. */
export const MIN_SAMPLE_STEPS = 100

/**
 * The estimate and its range. Each reading (sample, gross, tare) is taken to be within one
 * resolution step of the truth, a deliberately cautious reading of the scale's readability [common practice].
 */
export function countByWeight(input: CountByWeightInput): CountByWeightResult {
  const { sampleCount: n, sampleWeightG: s, totalWeightG: gross, scaleResolutionG: r } = input
  const tare = input.tareG ?? 0
  const net = gross - tare
  const piece = s / n
  const netError = input.tareG ? 2 * r : r
  const pieceLow = (s - r) / n
  const pieceHigh = (s + r) / n
  const count = Math.round(net / piece)
  const low = Math.max(0, Math.floor((net - netError) / pieceHigh))
  const high = pieceLow > 0 ? Math.ceil((net + netError) / pieceLow) : Number.POSITIVE_INFINITY
  const warnings: string[] = []
  if (n < MIN_SAMPLE_COUNT) warnings.push(`Weigh a sample of at least ${MIN_SAMPLE_COUNT} pieces for a steadier piece weight.`)
  if (s < MIN_SAMPLE_STEPS * r) warnings.push(`The sample should weigh at least ${MIN_SAMPLE_STEPS} × the scale resolution (${round(MIN_SAMPLE_STEPS * r, 3)} g).`)
  if (net < s) warnings.push('The lot weighs less than the sample: check the tare and the readings.')
  return {
    count,
    low,
    high,
    pieceWeightG: round(piece, 6),
    netWeightG: round(net, 6),
    relativeError: count > 0 ? round((high - low) / 2 / count, 4) : 0,
    warnings,
  }
}

const round = (x: number, places: number) => Number(x.toFixed(places))
