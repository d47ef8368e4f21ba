/**
 * Densities of the bar and tube materials a model-engineering workshop stocks, in kg/m³.
 * Each entry names its source; where sources disagree the range seen is kept beside the value used.
 */

export interface Material {
  id: string
  name: string
  /** Value used in calculations. */
  densityKgM3: number
  /** Spread across the sources consulted [low, high]. */
  rangeKgM3: [number, number]
  source: string
  /** Other words people type for it: `brass`, `steel`, `aluminium`. */
  aliases: string[]
}

export const MATERIALS: readonly Material[] = [
  { id: 'mild-steel', name: 'Mild steel (S275, bright 230M07)', densityKgM3: 7850, rangeKgM3: [7850, 7850],
    source: 'Civil-engineering unit-weight tables; D²/162 rule', aliases: ['steel', 'ms', 'mild steel', 's275', 'en1a'] },
  { id: 'free-cutting-steel', name: 'Free-cutting steel (230M07 / 11SMnPb30)', densityKgM3: 7850, rangeKgM3: [7850, 7850],
    source: 'From memory', aliases: ['free cutting steel', 'fcms', '230m07', '11smnpb30', 'leaded steel'] },
  { id: 'silver-steel', name: 'Silver steel (BS 1407)', densityKgM3: 7850, rangeKgM3: [7830, 7850],
    source: 'From memory', aliases: ['silver steel', 'drill rod', 'bs1407'] },
  { id: 'stainless-303', name: 'Stainless steel 303 (1.4305)', densityKgM3: 8000, rangeKgM3: [7900, 8030],
    source: 'From memory (a 304 datasheet gives 8.03 g/cm³)', aliases: ['stainless', '303', 'ss303', '1.4305'] },
  { id: 'stainless-304', name: 'Stainless steel 304 (1.4301)', densityKgM3: 8000, rangeKgM3: [7900, 8030],
    source: 'Alloy supplier datasheet 8.03 g/cm³; EN 10088-1 7.9 (from memory)', aliases: ['304', 'ss304', '1.4301'] },
  { id: 'stainless-316', name: 'Stainless steel 316 (1.4401)', densityKgM3: 8000, rangeKgM3: [7980, 8000],
    source: 'Metal supplier datasheet, 8.0 g/cm³', aliases: ['316', 'ss316', '1.4401'] },
  { id: 'brass', name: 'Brass CZ121 / CW614N (CuZn39Pb3)', densityKgM3: 8470, rangeKgM3: [8470, 8470],
    source: 'Durbin Metals and azom datasheets, 8.47 g/cm³', aliases: ['cz121', 'cw614n', 'free cutting brass'] },
  { id: 'phosphor-bronze', name: 'Phosphor bronze PB102 / CW451K (CuSn5)', densityKgM3: 8850, rangeKgM3: [8800, 8850],
    source: 'Durbin Metals and John Hood datasheets 8.85 g/cm³; makeitfrom 8.8', aliases: ['phosphor bronze', 'pb102', 'cw451k', 'bronze'] },
  { id: 'gunmetal', name: 'Gunmetal LG2 / CC491K (CuSn5Zn5Pb5)', densityKgM3: 8800, rangeKgM3: [8700, 8830],
    source: 'Foundry datasheet 8.7 g/cm³; 8.8 from memory', aliases: ['lg2', 'cc491k', 'gun metal'] },
  { id: 'copper', name: 'Copper C101 / CW004A (Cu-ETP)', densityKgM3: 8940, rangeKgM3: [8890, 8940],
    source: 'Cu-ETP mill datasheet 8.94 g/cm³; CDA C11000 8.89–8.94', aliases: ['c101', 'cw004a', 'cu-etp', 'c11000'] },
  { id: 'aluminium-6082', name: 'Aluminium alloy 6082', densityKgM3: 2700, rangeKgM3: [2700, 2710],
    source: 'From memory; 6xxx alloys 2.70 g/cm³ on a material-properties page', aliases: ['aluminium', 'aluminum', 'alu', '6082', 'he30'] },
  { id: 'aluminium-2011', name: 'Aluminium alloy 2011 (FC1)', densityKgM3: 2830, rangeKgM3: [2820, 2840],
    source: 'Wilsons and John Hood datasheets 2.83 g/cm³; BTI 2.82', aliases: ['2011', 'fc1', 'free cutting aluminium'] },
  { id: 'cast-iron', name: 'Grey cast iron (EN-GJL)', densityKgM3: 7200, rangeKgM3: [6600, 7400],
    source: "Foundry lexicon (typ. 7050–7300); Machinery's Handbook 0.260 lb/in³ (from memory)", aliases: ['cast iron', 'ci', 'en-gjl', 'grey iron', 'meehanite'] },
]

const normalise = (s: string) => s.trim().toLowerCase().replace(/[\s_]+/g, ' ')

/** Finds a material by id, name or alias, ignoring case: `brass`, `CZ121`, `mild-steel`, `Stainless`. */
export function findMaterial(text: string): Material | undefined {
  const key = normalise(text)
  if (!key) return undefined
  return MATERIALS.find((m) => m.id === key.replace(/ /g, '-') || normalise(m.name) === key || m.aliases.includes(key))
}
