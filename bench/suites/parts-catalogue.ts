/**
 * An invented 50,000-part catalogue for the search benchmark, inserted in bulk in one
 * transaction (seconds instead of minutes through createPart one by one). Columns are derived
 * by the same derivePartColumns and suggestPartCode the app uses.
 */
import type { DataSource } from 'typeorm'
import type Database from 'better-sqlite3'
import { Bin, Rack, Workshop } from '../../server/entities'
import { derivePartColumns, suggestPartCode } from '../../server/services/parts'
import type { PartAttributes } from '../../shared/schemas/part'

const BINS = 400
/** Share of parts with stock in a bin, so list rows carry real on-hand figures. */
const STOCKED = 0.6

const THREADS = [
  ...Array.from({ length: 13 }, (_, n) => `${n}BA`), 'M1.6', 'M2', 'M2.5', 'M3', 'M4', 'M5', 'M6', 'M8', 'M10', 'M12',
  'M3x0.35', 'M4x0.5', 'M5x0.5', 'M6x0.75', 'M8x1', '1/8-40 ME', '5/32-40 ME', '3/16-40 ME', '7/32-40 ME', '1/4-40 ME',
  '1/4-32 ME', '5/16-32 ME', '3/8-32 ME', '#4-40 UNC', '#6-32 UNC', '1/4-20 UNC', '1/4-28 UNF', '1/4 BSW', '5/16 BSW', '3/8 BSF',
]
const TYPES = ['stud', 'nut', 'screw', 'bolt', 'washer', 'pin'] as const
const LENGTHS = [3, 4, 5, 6, 8, 10, 12, 16, 20, 25, 30, 40, 50]
const FASTENER_MATERIALS = ['brass', 'stainless 303', 'stainless A2', 'mild steel', 'phosphor bronze', 'high tensile steel', 'nylon']
const HEADS = ['hex', 'cheese', 'socket cap', 'countersunk', 'round']
const SECTIONS = ['round', 'hex', 'square', 'flat', 'tube', 'sheet'] as const
const SIZES = [1, 1.5, 2, 2.5, 3, 3.175, 4, 4.762, 5, 6, 6.35, 8, 9.525, 10, 12, 12.7, 15, 16, 19.05, 20, 25, 25.4, 30, 32, 40, 50]
const BAR_MATERIALS = ['brass', 'bright mild steel', 'mild steel', 'stainless 303', 'silver steel', 'phosphor bronze', 'gunmetal', 'copper', 'aluminium 6082', 'cast iron']
const GASKET_MATERIALS = ['compressed fibre', 'gasket paper', 'PTFE', 'copper', 'graphite']
const COMPOUNDS = ['medium-strength thread-locker', 'high-strength retaining compound', 'steam cylinder oil', 'light machine oil', 'neat cutting oil', 'high-melting-point grease', 'jointing compound', 'soft solder flux']
const OTHER_WORDS = ['whistle', 'valve', 'injector', 'clack', 'gauge', 'lubricator', 'regulator', 'blower', 'safety', 'cylinder', 'piston',
  'gland', 'eccentric', 'crosshead', 'axlebox', 'buffer', 'coupling', 'chimney', 'dome', 'smokebox', 'firebox', 'grate', 'tender',
  'bogie', 'wheel', 'spring', 'casting', 'bush', 'union', 'nipple', 'elbow', 'tee', 'cock', 'drain', 'bracket', 'sight', 'glass']
/** Invented stockists, so that the same bar from two sources is two parts. */
const SOURCES = ['Wyvern', 'Hollin', 'Ashby', 'Marsden', 'Tolland', 'Brearley', 'Cotter', 'Kettlewell']

/** Deterministic pseudo-random numbers: every run benchmarks the same catalogue. */
function rng(seed: number) {
  let s = seed
  return () => ((s = (s * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff)
}

function invent(rand: () => number): { name: string; attributes: PartAttributes } {
  const pick = <T>(list: readonly T[]) => list[Math.floor(rand() * list.length)]
  const r = rand()
  if (r < 0.6) {
    const type = pick(TYPES)
    const thread = pick(THREADS)
    const material = pick(FASTENER_MATERIALS)
    const lengthMm = type === 'nut' || type === 'washer' ? null : pick(LENGTHS)
    const head = type === 'screw' || type === 'bolt' ? pick(HEADS) : undefined
    const name = `${thread} ${head ? `${head} ` : ''}${type}${lengthMm ? ` ${lengthMm} mm` : ''}, ${material}`
    return { name, attributes: { kind: 'fastener', type, thread, lengthMm, material, head } }
  }
  if (r < 0.85) {
    const section = pick(SECTIONS)
    const material = pick(BAR_MATERIALS)
    const sizeMm = pick(SIZES)
    return { name: `${material} ${section} ${sizeMm} mm (${pick(SOURCES)})`, attributes: { kind: 'stock', section, material, sizeMm } }
  }
  if (r < 0.92) {
    const material = pick(GASKET_MATERIALS)
    const thicknessMm = pick([0.25, 0.4, 0.5, 0.8, 1, 1.5])
    return { name: `${pick(OTHER_WORDS)} gasket ${thicknessMm} mm, ${material}`, attributes: { kind: 'gasket', material, thicknessMm } }
  }
  if (r < 0.95) {
    const grade = pick(COMPOUNDS)
    return { name: `${grade}, ${pick(['10 ml', '50 ml', '500 ml', '1 l'])} (${pick(SOURCES)})`, attributes: { kind: 'compound', grade, containerSize: '10 ml', hazardous: grade.includes('thread') } }
  }
  const words = [pick(OTHER_WORDS), pick(OTHER_WORDS), pick(['casting', 'body', 'fitting', 'set'])]
  return { name: words.join(' '), attributes: { kind: 'other', properties: { material: pick(['gunmetal', 'brass', 'bronze']) } } }
}

/** Rows for the parts table, inventing each part and deriving its columns as createPart does. */
function inventRows(count: number, rand: () => number) {
  const codes = new Set<string>()
  return Array.from({ length: count }, (_, i) => {
    const { name, attributes } = invent(rand)
    const base = suggestPartCode(attributes, name)
    let code = base
    for (let n = 2; codes.has(code); n++) code = `${base.slice(0, 42)}-${n}`
    codes.add(code)
    const c = derivePartColumns(attributes)
    return [code, name, attributes.kind, JSON.stringify(attributes), c.form, c.threadKey, c.lengthMm, c.sizeMm, c.material,
      attributes.kind === 'stock' ? 'mm' : 'pcs', Math.floor(rand() * 20), `PB${i.toString(36).toUpperCase().padStart(8, '0')}`]
  })
}

/**
 * Inserts `count` parts (60 % with stock in one of 400 bins) into an empty SQLite database with
 * prepared statements in one transaction; returns the time taken in ms. The lots are written
 * without ledger rows: this database only serves the search benchmark.
 */
export async function seedCatalogue(ds: DataSource, count: number): Promise<number> {
  const t0 = performance.now()
  const rand = rng(42)
  const workshop = await ds.getRepository(Workshop).save({ name: 'Bench workshop' })
  const rack = await ds.getRepository(Rack).save({ code: 'R1', name: 'Bench rack', workshopId: workshop.id })
  const bins = await ds.getRepository(Bin).save(Array.from({ length: BINS }, (_, i) => ({
    code: `R1-${String(i + 1).padStart(3, '0')}`, labelCode: `BBENCH${i}`, description: '', rackId: rack.id, retired: false, defaultPartId: null,
  })))
  const rows = inventRows(count, rand)
  const sqlite = (ds.driver as unknown as { databaseConnection: Database.Database }).databaseConnection
  const insertPart = sqlite.prepare(`INSERT INTO parts (code, name, kind, attributes, form, threadKey, lengthMm, sizeMm, material,
    unit, reorderPoint, labelCode) VALUES (${Array(12).fill('?').join(', ')})`)
  const insertLot = sqlite.prepare('INSERT INTO stock_lots (partId, binId, quantity) VALUES (?, ?, ?)')
  sqlite.transaction(() => {
    for (const row of rows) {
      const { lastInsertRowid } = insertPart.run(...row)
      if (rand() < STOCKED) insertLot.run(lastInsertRowid, bins[Math.floor(rand() * bins.length)].id, 1 + Math.floor(rand() * 200))
    }
  })()
  return performance.now() - t0
}
