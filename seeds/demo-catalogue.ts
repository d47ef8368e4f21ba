import type { PartInput } from '../shared/schemas/part'

/** A stock line of the demo: the part, and what is in which bin. */
export interface DemoStock {
  part: PartInput
  /** Bin code and quantity (bar stock: a piece length in mm); batch expiry counted from seeding day. */
  stock: { bin: string; quantity: number; pieces?: number; batchCode?: string; expiresInDays?: number }[]
}

const stud = (thread: string, lengthMm: number, material: string, reorderPoint = 0): PartInput => ({
  name: `${thread} stud ${lengthMm} mm, ${material}`,
  attributes: { kind: 'fastener', type: 'stud', thread, lengthMm, material },
  reorderPoint, reorderQuantity: reorderPoint * 2, unitCost: 0.12, tags: ['studding'],
})
const nut = (thread: string, material: string, reorderPoint = 0): PartInput => ({
  name: `${thread} full nut, ${material}`,
  attributes: { kind: 'fastener', type: 'nut', thread, material, head: 'hex' },
  reorderPoint, reorderQuantity: reorderPoint * 2, unitCost: 0.08,
})
const bar = (material: string, section: 'round' | 'hex' | 'square' | 'flat' | 'tube', sizeMm: number, extra: Partial<{ wallMm: number; thicknessMm: number }> = {}, pressureBearing = false): PartInput => ({
  name: `${material} ${section} bar ${sizeMm} mm`,
  attributes: { kind: 'stock', material, section, sizeMm, ...extra },
  unitCost: 0.02, pressureBearing,
})

/** The invented Hollin Dale society's clubroom stores. */
export const DEMO_CATALOGUE: DemoStock[] = [
  { part: stud('7BA', 12, 'brass', 40), stock: [{ bin: 'A1-01', quantity: 64 }] },
  { part: stud('7BA', 16, 'stainless 303', 20), stock: [{ bin: 'A1-02', quantity: 18 }] },
  { part: nut('7BA', 'brass', 50), stock: [{ bin: 'A1-03', quantity: 120 }, { bin: 'A1-04', quantity: 30 }] },
  { part: stud('6BA', 20, 'brass', 30), stock: [{ bin: 'A1-05', quantity: 45 }] },
  { part: nut('6BA', 'brass', 40), stock: [{ bin: 'A1-06', quantity: 35 }] },
  { part: stud('5BA', 25, 'mild steel'), stock: [{ bin: 'A1-07', quantity: 24 }] },
  { part: nut('5BA', 'mild steel'), stock: [{ bin: 'A1-08', quantity: 60 }] },
  { part: stud('4BA', 30, 'stainless 303'), stock: [{ bin: 'A1-09', quantity: 16 }] },
  { part: nut('4BA', 'stainless 303'), stock: [{ bin: 'A1-10', quantity: 40 }] },
  { part: stud('5/32-40 ME', 20, 'stainless 303', 12), stock: [{ bin: 'A2-01', quantity: 10 }] },
  { part: nut('5/32-40 ME', 'brass', 20), stock: [{ bin: 'A2-02', quantity: 48 }] },
  { part: { name: 'M3 × 12 socket cap screw, stainless A2', attributes: { kind: 'fastener', type: 'screw', thread: 'M3', lengthMm: 12, material: 'stainless A2', head: 'socket cap', drive: 'hex key 2.5' }, reorderPoint: 25, reorderQuantity: 100, unitCost: 0.09 }, stock: [{ bin: 'A2-03', quantity: 85 }] },
  { part: nut('M3', 'stainless A2', 30), stock: [{ bin: 'A2-04', quantity: 140 }] },
  { part: nut('M4', 'mild steel, zinc plated'), stock: [{ bin: 'A2-05', quantity: 90 }] },
  { part: { name: 'M4 × 0.5 fine stud 16 mm, brass', attributes: { kind: 'fastener', type: 'stud', thread: 'M4x0.5', lengthMm: 16, material: 'brass' }, unitCost: 0.2 }, stock: [{ bin: 'A2-06', quantity: 12 }] },
  { part: { name: '7BA plain washer, brass', attributes: { kind: 'fastener', type: 'washer', thread: '7BA', material: 'brass' }, unitCost: 0.03 }, stock: [{ bin: 'A2-07', quantity: 200 }] },
  { part: { name: 'Cylinder cover gasket 0.4 mm, compressed fibre', attributes: { kind: 'gasket', material: 'compressed fibre', thicknessMm: 0.4, shape: 'cut to cover drawing' }, reorderPoint: 4, reorderQuantity: 10, unitCost: 0.5 }, stock: [{ bin: 'A3-01', quantity: 6 }] },
  { part: { name: 'Valve chest gasket 0.25 mm, gasket paper', attributes: { kind: 'gasket', material: 'gasket paper', thicknessMm: 0.25 }, reorderPoint: 4, reorderQuantity: 10, unitCost: 0.3 }, stock: [{ bin: 'A3-02', quantity: 3 }] },
  { part: { name: 'Gland packing, PTFE-graphite yarn 1.5 mm', attributes: { kind: 'gasket', material: 'PTFE graphite yarn', thicknessMm: 1.5, shape: 'yarn, cut to length' }, unit: 'm', unitCost: 0.8 }, stock: [{ bin: 'A3-03', quantity: 5 }] },
  { part: bar('brass', 'hex', 6.35), stock: [{ bin: 'B1-01', quantity: 1000 }, { bin: 'B1-01', quantity: 310 }] },
  { part: bar('brass', 'round', 9.525), stock: [{ bin: 'B1-02', quantity: 500 }] },
  { part: bar('mild steel', 'round', 12), stock: [{ bin: 'B1-03', quantity: 1000, pieces: 2 }] },
  { part: bar('phosphor bronze', 'round', 16), stock: [{ bin: 'B1-04', quantity: 250 }] },
  { part: bar('silver steel', 'round', 6), stock: [{ bin: 'B1-05', quantity: 333 }] },
  { part: bar('copper', 'tube', 15, { wallMm: 1 }, true), stock: [{ bin: 'B1-06', quantity: 600 }] },
  { part: bar('mild steel', 'flat', 25, { thicknessMm: 6 }), stock: [{ bin: 'B1-07', quantity: 900 }] },
  {
    part: { name: 'Thread-locker, medium strength, 10 ml', attributes: { kind: 'compound', grade: 'medium-strength thread-locker', containerSize: '10 ml', hazardous: true }, reorderPoint: 1, reorderQuantity: 3, unitCost: 6.5, unit: 'bottle' },
    stock: [{ bin: 'C1-01', quantity: 1, batchCode: 'TL-2211', expiresInDays: -17 }, { bin: 'C1-01', quantity: 2, batchCode: 'TL-2307', expiresInDays: 210 }],
  },
  { part: { name: 'Retaining compound, high strength, 10 ml', attributes: { kind: 'compound', grade: 'high-strength retaining compound', containerSize: '10 ml', hazardous: true }, unitCost: 7.2, unit: 'bottle' }, stock: [{ bin: 'C1-02', quantity: 1, batchCode: 'RC-2402', expiresInDays: 18 }] },
  { part: { name: 'Steam cylinder oil, 500 ml', attributes: { kind: 'compound', grade: 'steam cylinder oil (ISO VG 460)', containerSize: '500 ml' }, reorderPoint: 1, reorderQuantity: 2, unitCost: 9.0, unit: 'tin' }, stock: [{ bin: 'C1-03', quantity: 2, batchCode: 'SC-24', expiresInDays: 850 }] },
  { part: { name: 'Machine oil, 1 litre', attributes: { kind: 'compound', grade: 'light machine oil (ISO VG 68)', containerSize: '1 l' }, unitCost: 8.0, unit: 'bottle' }, stock: [{ bin: 'C1-04', quantity: 3, batchCode: 'MO-25', expiresInDays: 1150 }] },
  { part: { name: 'Cutting fluid, 500 ml', attributes: { kind: 'compound', grade: 'neat cutting oil', containerSize: '500 ml' }, unitCost: 6.0, unit: 'bottle' }, stock: [{ bin: 'C1-04', quantity: 1, batchCode: 'CF-25', expiresInDays: 940 }] },
  { part: { name: 'PTFE thread-seal tape, 12 mm', attributes: { kind: 'other', properties: { width: '12 mm', length: '12 m' } }, unit: 'reel', unitCost: 0.6 }, stock: [{ bin: 'C1-05', quantity: 8 }] },
  { part: { name: 'Whistle valve body casting, gunmetal', attributes: { kind: 'other', properties: { material: 'gunmetal LG2', use: 'boiler fitting' } }, pressureBearing: true, unitCost: 12 }, stock: [{ bin: 'C1-06', quantity: 2 }] },
  // Parts search examples ('1/4 unc', '3/8 round bms'): catalogued, none in stock yet, no reorder point.
  { part: { name: '1/4-20 UNC hex bolt 1 in, stainless 304', attributes: { kind: 'fastener', type: 'bolt', thread: '1/4-20 UNC', lengthMm: 25.4, material: 'stainless 304', head: 'hex' }, unitCost: 0.35 }, stock: [] },
  { part: bar('bright mild steel', 'round', 9.525), stock: [] },
]
