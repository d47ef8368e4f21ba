/**
 * Search queries for the parts benchmark: the trade mix people type again and again, and a long
 * list of distinct queries in the same trade words that no earlier request has asked (so no
 * cached answer can serve them: the cache-miss figures).
 */

/** What people type, as in the issue, plus an empty box, a typo and a plain word. */
export const QUERY_MIX = [
  '7ba nut', 'm3 x 12 stainless', 'M4x0.5', '5/32-40 stud', '1/4 unc', 'brass hex 1/4', '3/8 round bms', 'gasket 0.4',
  'thread locker', 'studd', 'bras', '6ba stud 20 brass', 'whistle valve', '', 'copper tube', 'm6 x 20 screw',
  'pb round 16', 'injectr clack',
]

const THREADS = ['2ba', '4ba', '5ba', '6ba', '8ba', '10ba', 'm2', 'm2.5', 'm3', 'm4', 'm5', 'm6', 'm8', '1/8-40', '5/32-40', '3/16-40', '1/4-40', '1/4 unc', '1/4 bsw', '5/16 bsw']
const TYPES = ['nut', 'stud', 'screw', 'bolt', 'washer', 'pin', 'cap screw', 'hex bolt']
const MATERIALS = ['brass', 'stainless', 'steel', 'bronze', 'ms', 'pb', 'nylon', 'a2']
const LENGTHS = [3, 4, 5, 6, 8, 10, 12, 16, 20, 25, 30, 40, 50]
const SECTIONS = ['round', 'hex', 'square', 'flat', 'tube', 'sheet']
const SIZES = ['1', '1.5', '2', '3', '4', '5', '6', '8', '10', '12', '16', '20', '25', '1/8', '3/16', '1/4', '5/16', '3/8', '1/2', '3/4']
const WORDS = ['whistle', 'valve', 'injector', 'clack', 'gauge', 'lubricator', 'regulator', 'blower', 'safety', 'cylinder', 'piston',
  'gland', 'eccentric', 'crosshead', 'axlebox', 'buffer', 'coupling', 'chimney', 'dome', 'smokebox', 'firebox', 'grate', 'tender',
  'bogie', 'wheel', 'spring', 'casting', 'bush', 'union', 'nipple', 'elbow', 'tee', 'cock', 'drain', 'bracket', 'gasket', 'oil']

/** Deterministic shuffle: every run asks the same queries in the same order. */
function shuffle<T>(xs: T[]): T[] {
  let s = 7
  const rand = () => ((s = (s * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff)
  for (let i = xs.length - 1; i > 0; i--) {
    const j = Math.floor(rand() * (i + 1))
    ;[xs[i], xs[j]] = [xs[j], xs[i]]
  }
  return xs
}

/** A one-letter slip: the second letter dropped ("valve" → "vlve"). */
const slip = (w: string) => w.length > 4 ? w[0] + w.slice(2) : w

/** Distinct trade queries (none in QUERY_MIX), in a fixed mixed-up order. */
export function distinctQueries(): string[] {
  const out = new Set<string>()
  for (const t of THREADS) for (const ty of TYPES) {
    for (const l of LENGTHS) { out.add(`${t} ${ty} ${l}`); out.add(`${t} x ${l} ${ty}`) }
    for (const m of MATERIALS) { out.add(`${t} ${ty} ${m}`); for (const l of LENGTHS.slice(0, 6)) out.add(`${t} ${ty} ${l} ${m}`) }
  }
  for (const m of MATERIALS) for (const s of SECTIONS) for (const z of SIZES) { out.add(`${m} ${s} ${z}`); out.add(`${z} ${s} ${m}`) }
  for (const a of WORDS) for (const b of WORDS) if (a !== b) { out.add(`${a} ${b}`); out.add(`${slip(a)} ${b}`) }
  for (const q of QUERY_MIX) out.delete(q)
  return shuffle([...out])
}
