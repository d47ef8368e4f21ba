import { describe, expect, it } from 'vitest'
import QRCode from 'qrcode'
import {
  BYTE_CAPACITY, darkRuns, LABEL_QR_LEVEL, MIN_MODULE_MM, QR_LEVELS, REQUIRED_QUIET_ZONE_MODULES, modulesPerSide, qrFit,
  qrVersionFor,
} from '../../../shared/domain/label-qr'
import { DEFAULT_LABEL_FIELDS, labelBoxes, LABEL_PADDING_MM } from '../../../shared/domain/label-layout'
import { SHEET_PRESETS } from '../../../shared/domain/label-sheets'

/** Version the qrcode package picks for `text` forced into byte mode (an independent encoder). */
const encoderVersion = (text: string, level: string) =>
  QRCode.create([{ data: Buffer.from(text), mode: 'byte' }], { errorCorrectionLevel: level as QRCode.QRCodeErrorCorrectionLevel }).version

/** A long public address for a part label: 62 bytes, the most a version 4 symbol holds at M. */
const LONG_URL = 'https://stores.hollindale-sme.example/parts/by-label/P01234567'
/** The address of a bin label on the default server. */
const LOCAL_URL = 'http://localhost:3000/bins/B0123ABCD'

describe('QR version and module size', () => {
  it.each(QR_LEVELS)('byte capacities at level %s match the qrcode encoder (ISO/IEC 18004 table 7, from memory)', (level) => {
    BYTE_CAPACITY[level].forEach((cap, i) => {
      expect(encoderVersion('a'.repeat(cap), level)).toBe(i + 1)
      expect(encoderVersion('a'.repeat(cap + 1), level)).toBe(i + 2)
    })
  })

  it('gives 17 + 4 × version modules per side (ISO/IEC 18004)', () => {
    expect(modulesPerSide(1)).toBe(21)
    expect(modulesPerSide(3)).toBe(29)
    expect(modulesPerSide(4)).toBe(33)
  })

  it('draws a symbol as row runs that cover exactly its dark modules', () => {
    expect(darkRuns(3, [1, 1, 0, 0, 0, 0, 0, 1, 1])).toEqual([
      { row: 0, start: 0, length: 2 }, { row: 2, start: 1, length: 2 },
    ])
    const { size, data } = QRCode.create('http://localhost:3000/bins/A1-03', { errorCorrectionLevel: LABEL_QR_LEVEL }).modules
    const painted = new Array<number>(size * size).fill(0)
    for (const r of darkRuns(size, data)) for (let c = r.start; c < r.start + r.length; c++) painted[r.row * size + c] += 1
    expect(painted).toEqual(Array.from(data, (v) => (v ? 1 : 0)))
  })

  it('fits our URLs at level M in version 3 (local) or 4 (a long public address)', () => {
    expect(LABEL_QR_LEVEL).toBe('M')
    expect(qrVersionFor(LOCAL_URL.length)).toBe(3)
    expect(LONG_URL.length).toBe(62)
    expect(qrVersionFor(LONG_URL.length)).toBe(4)
    expect(qrVersionFor(300)).toBeNull()
  })

  it('works out the module size: a 20 mm square with a version 3 symbol and its 2-module margin', () => {
    const fit = qrFit(LOCAL_URL, 20, 1.5)
    expect(fit.modules).toBe(29)
    expect(fit.moduleMm).toBeCloseTo(20 / 33, 9)
    expect(fit.quietZoneMm).toBeCloseTo(1.5 + 2 * (20 / 33), 9)
    expect(fit.scannable).toBe(true)
  })

  it('refuses modules under 0.25 mm (common practice for phone cameras at 10–20 cm)', () => {
    expect(MIN_MODULE_MM).toBe(0.25)
    const tiny = qrFit(LONG_URL, 9, 1.5)
    expect(tiny.moduleMm).toBeCloseTo(9 / 37, 9)
    expect(tiny.scannable).toBe(false)
    expect(tiny.problem).toMatch(/0\.24 mm wide; phones need at least 0\.25 mm/)
  })

  it('widens the margin inside the square when the label padding cannot make up the 4-module quiet zone', () => {
    // 40 mm square, 1.5 mm padding: 2-module margins would give 40 / 33 = 1.21 mm modules and only
    // 1.5 + 2.42 = 3.92 mm of white, under 4 × 1.21; so (40 + 3) / (29 + 8) mm modules instead.
    const big = qrFit(LOCAL_URL, 40, 1.5)
    expect(big.moduleMm).toBeCloseTo(43 / 37, 9)
    expect(big.quietZoneMm).toBeCloseTo(4 * big.moduleMm, 9)
    expect(big.marginMm * 2 + 29 * big.moduleMm).toBeCloseTo(40, 9)
    expect(qrFit(LOCAL_URL, 20, 0).quietZoneMm).toBeCloseTo(4 * (20 / 37), 9)
  })
})

describe('QR codes on every preset sheet', () => {
  it.each(SHEET_PRESETS.map((s) => [s.name, s] as const))('%s prints a long address at ≥ 0.25 mm modules with a 4-module quiet zone', (_n, s) => {
    const boxes = labelBoxes(s.labelWidthMm, s.labelHeightMm, { code: 'A1-03', name: 'x', detail: 'x', caution: null, url: LONG_URL }, DEFAULT_LABEL_FIELDS)
    const fit = boxes.qr!.fit
    expect(fit.scannable).toBe(true)
    expect(fit.moduleMm).toBeGreaterThanOrEqual(MIN_MODULE_MM)
    expect(fit.quietZoneMm).toBeGreaterThanOrEqual(REQUIRED_QUIET_ZONE_MODULES * fit.moduleMm)
  })

  it('keeps modules near half a millimetre on the smallest preset (38.1 × 21.2 mm)', () => {
    const smallest = [...SHEET_PRESETS].sort((a, b) => a.labelWidthMm * a.labelHeightMm - b.labelWidthMm * b.labelHeightMm)[0]
    expect(smallest.id).toBe('a4-5x13-38.1x21.2')
    const boxes = labelBoxes(38.1, 21.2, { code: 'A1-03', name: '', detail: '', caution: null, url: LONG_URL }, DEFAULT_LABEL_FIELDS)
    // The square is 21.2 − 2 × 1.5 = 18.2 mm; version 4 has 33 modules + 2 × 2 margin = 37.
    expect(boxes.qr!.w).toBeCloseTo(21.2 - 2 * LABEL_PADDING_MM, 9)
    expect(boxes.qr!.fit.moduleMm).toBeCloseTo(18.2 / 37, 9)
  })
})

describe('text beside the QR code', () => {
  it('prints the bin code as large as fits beside the QR code, and larger without it', () => {
    const content = { code: 'A1-03', name: '7BA stud 12 mm, brass', detail: '7BA × 12 mm', caution: null, url: LOCAL_URL }
    const withQr = labelBoxes(70, 37, content, DEFAULT_LABEL_FIELDS)
    const without = labelBoxes(70, 37, content, { ...DEFAULT_LABEL_FIELDS, qr: false })
    expect(withQr.text.x).toBeCloseTo(1.5 + 34 + 1, 9)
    expect(withQr.codePt).toBeGreaterThan(withQr.textPt * 1.5)
    expect(without.codePt).toBeGreaterThan(withQr.codePt)
    expect(without.qr).toBeNull()
  })
})
