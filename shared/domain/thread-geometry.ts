/** Basic dimensions of each thread form and the rules for its tapping and clearance holes. */
import { SERIES_FORM, type ThreadForm, type ThreadSpec } from './thread-data'
import type { DrillSystem } from './drills'

/** BS 93: flank angle 47.5°, depth 0.6p: d2 = d − 0.6p, d1 = d − 1.2p. */
export const BA_ANGLE_DEG = 47.5
export const BA_DEPTH_FACTOR = 0.6
/** ISO 68-1 / ASME B1.1 basic profile, H = 0.866025P: d2 = d − 0.649519P, D1 = d − 1.082532P. */
export const ISO_ANGLE_DEG = 60
export const ISO_PITCH_DIAMETER_FACTOR = 0.649519
export const ISO_INTERNAL_MINOR_FACTOR = 1.082532
/** ISO 68-1 external (bolt) minor diameter d3 = d − 1.226869P (root radius H/6). */
export const ISO_EXTERNAL_MINOR_FACTOR = 1.226869
/** Machinery's Handbook "percentage of thread": 100 % is a double depth of 1.299038P (= 1.5H). */
export const ISO_FULL_THREAD_FACTOR = 1.299038
/** BS 84 Whitworth form: 55°, depth h = 0.640327p. */
export const WHITWORTH_ANGLE_DEG = 55
export const WHITWORTH_DEPTH_FACTOR = 0.640327
/** Thread engagement aimed at by the tapping rules: 75 % [common practice; 65–80 % in steel]. */
export const TARGET_ENGAGEMENT = 0.75

export interface ThreadGeometry {
  form: ThreadForm
  angleDeg: number
  pitchDiameterMm: number
  /** Minor diameter of the tapped hole: no tapping drill may be smaller. */
  minorDiameterMm: number
  /** ISO metric only: minor diameter of the bolt (d3). */
  externalMinorDiameterMm?: number
  /** Diameter at which the thread would be 100 % deep: the base of the engagement percentage. */
  fullThreadMinorMm: number
}

export function geometryOf(t: ThreadSpec): ThreadGeometry {
  const { majorMm: d, pitchMm: p } = t
  const form = SERIES_FORM[t.series]
  if (form === 'BA') {
    const minor = d - 2 * BA_DEPTH_FACTOR * p
    return { form, angleDeg: BA_ANGLE_DEG, pitchDiameterMm: d - BA_DEPTH_FACTOR * p, minorDiameterMm: minor, fullThreadMinorMm: minor }
  }
  if (form === 'Whitworth') {
    const minor = d - 2 * WHITWORTH_DEPTH_FACTOR * p
    return { form, angleDeg: WHITWORTH_ANGLE_DEG, pitchDiameterMm: d - WHITWORTH_DEPTH_FACTOR * p, minorDiameterMm: minor, fullThreadMinorMm: minor }
  }
  return {
    form,
    angleDeg: ISO_ANGLE_DEG,
    pitchDiameterMm: d - ISO_PITCH_DIAMETER_FACTOR * p,
    minorDiameterMm: d - ISO_INTERNAL_MINOR_FACTOR * p,
    ...(form === 'ISO' ? { externalMinorDiameterMm: d - ISO_EXTERNAL_MINOR_FACTOR * p } : {}),
    fullThreadMinorMm: d - ISO_FULL_THREAD_FACTOR * p,
  }
}

export interface DrillRule {
  theoreticalMm: number
  rule: string
}

/** The usual tapping size for each series, with the rule stated. */
export function tapRule(t: ThreadSpec, g: ThreadGeometry): DrillRule {
  const d = t.majorMm
  if (g.form === 'ISO') return { theoreticalMm: d - t.pitchMm, rule: 'd − P (ISO practice; about 77 % thread)' }
  const theoreticalMm = d - TARGET_ENGAGEMENT * (d - g.fullThreadMinorMm)
  if (g.form === 'UN') return { theoreticalMm, rule: "75 % thread: D − 0.974/n in (Machinery's Handbook)" }
  const depth = g.form === 'BA' ? 'd − 0.9p: 75 % of the BS 93 thread depth' : 'd − 0.96p: 75 % of the Whitworth thread depth'
  return { theoreticalMm, rule: `${depth} [common practice]` }
}

export type ClearanceFit = 'close' | 'medium'

/** ISO 273 clearance holes (fine = close, medium), mm [from memory; M3–M10 as commonly tabulated]. */
export const ISO_273: Readonly<Record<number, readonly [fine: number, medium: number, coarse: number]>> = {
  1.6: [1.7, 1.8, 2], 2: [2.2, 2.4, 2.6], 2.5: [2.7, 2.9, 3.1], 3: [3.2, 3.4, 3.6], 3.5: [3.7, 3.9, 4.2],
  4: [4.3, 4.5, 4.8], 5: [5.3, 5.5, 5.8], 6: [6.4, 6.6, 7], 8: [8.4, 9, 10], 10: [10.5, 11, 12],
  12: [13, 13.5, 14.5], 14: [15, 15.5, 16.5], 16: [17, 17.5, 18.5], 20: [21, 22, 24], 24: [25, 26, 28],
}

/**
 * Clearance over the major diameter where no table applies [common practice]: close +4 %, medium +10 %,
 * between the BA/ME workshop tables (+1…+6 %) and ISO 273 medium (+10…+13 % at M3–M10).
 */
export const CLEARANCE_FACTOR: Record<ClearanceFit, number> = { close: 1.04, medium: 1.1 }

export function clearanceRule(t: ThreadSpec, fit: ClearanceFit): DrillRule {
  const iso = t.series === 'M' || t.series === 'MF' ? ISO_273[t.majorMm] : undefined
  if (iso) {
    const [fine, medium] = iso
    return fit === 'close'
      ? { theoreticalMm: fine, rule: 'ISO 273 fine series' }
      : { theoreticalMm: medium, rule: 'ISO 273 medium series' }
  }
  const pct = Math.round((CLEARANCE_FACTOR[fit] - 1) * 100)
  return { theoreticalMm: t.majorMm * CLEARANCE_FACTOR[fit], rule: `major diameter + ${pct} % [common practice]` }
}

/** Metric threads prefer metric drills, Unified threads inch drills; BA and Whitworth-form use either. */
export function preferredDrills(form: ThreadForm): DrillSystem | undefined {
  if (form === 'ISO') return 'metric'
  if (form === 'UN') return 'inch'
  return undefined
}
