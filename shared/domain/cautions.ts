/**
 * Safety cautions shown where the user meets the risk (reference §11). The app records and
 * reminds; it certifies nothing.
 */
export type CautionKind = 'hazard' | 'pressure'

export interface Caution {
  kind: CautionKind
  /** A few words that fit on a label beside a warning triangle. */
  short: string
  /** One word for the narrowest labels. */
  word: string
  /** What the bin page and part page show next to the item. */
  text: string
}

export const CAUTIONS: Record<CautionKind, Caution> = {
  hazard: {
    kind: 'hazard',
    short: 'SDS · gloves',
    word: 'SDS',
    text: 'Thread-lockers and retaining compounds may cause an allergic skin reaction (H317) and irritate skin and eyes. '
      + 'Wear gloves and eye protection. If on skin, wash with soap and water; if in eyes, rinse cautiously for several minutes. '
      + 'Read the safety data sheet before use.',
  },
  pressure: {
    kind: 'pressure',
    short: 'Boiler code',
    word: 'Boiler',
    text: 'Pressure-bearing part: boiler work is tested and certified under your local boiler code by a competent boiler '
      + 'inspector. Binwright keeps records only; it does not certify boilers or fittings.',
  },
}

/** The cautions an item carries, hazard first. */
export function cautionsOf(item: { hazardous?: boolean; pressureBearing?: boolean }): CautionKind[] {
  const kinds: CautionKind[] = []
  if (item.hazardous) kinds.push('hazard')
  if (item.pressureBearing) kinds.push('pressure')
  return kinds
}
