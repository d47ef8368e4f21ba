import { describe, expect, it } from 'vitest'
import {
  THREAD_CATALOGUE, designationOf, keyOf, parseThread, threadKey, type ThreadSpec,
} from '../../../shared/domain/threads'

type Expected = Partial<Pick<ThreadSpec, 'series' | 'size' | 'pitchMm' | 'tpi'>> & { designation: string; key: string }

/** What users type → the thread meant. Sizes and pitches per BS 93, ISO 261, ASME B1.1, BS 84 and ME practice. */
const VALID: [string, Expected][] = [
  ['7BA', { series: 'BA', size: '7', pitchMm: 0.48, designation: '7BA', key: '7BA' }],
  ['7ba', { series: 'BA', size: '7', designation: '7BA', key: '7BA' }],
  ['7 BA', { series: 'BA', size: '7', designation: '7BA', key: '7BA' }],
  ['BA7', { series: 'BA', size: '7', designation: '7BA', key: '7BA' }],
  [' 0BA ', { series: 'BA', size: '0', pitchMm: 1, designation: '0BA', key: '0BA' }],
  ['16 ba', { series: 'BA', size: '16', pitchMm: 0.19, designation: '16BA', key: '16BA' }],
  ['10B.A.', { series: 'BA', size: '10', designation: '10BA', key: '10BA' }],
  ['M3', { series: 'M', size: '3', pitchMm: 0.5, designation: 'M3', key: 'M3x0.5' }],
  ['m3', { series: 'M', size: '3', pitchMm: 0.5, designation: 'M3', key: 'M3x0.5' }],
  ['M3x0.5', { series: 'M', size: '3', pitchMm: 0.5, designation: 'M3', key: 'M3x0.5' }],
  ['M3 x 0.5', { series: 'M', size: '3', designation: 'M3', key: 'M3x0.5' }],
  ['M4x0.5', { series: 'MF', size: '4', pitchMm: 0.5, designation: 'M4x0.5', key: 'M4x0.5' }],
  ['M4 x 0.5', { series: 'MF', size: '4', pitchMm: 0.5, designation: 'M4x0.5', key: 'M4x0.5' }],
  ['m4×0.5', { series: 'MF', size: '4', designation: 'M4x0.5', key: 'M4x0.5' }],
  ['M8x1', { series: 'MF', size: '8', pitchMm: 1, designation: 'M8x1', key: 'M8x1' }],
  ['M8 X 1.25', { series: 'M', size: '8', pitchMm: 1.25, designation: 'M8', key: 'M8x1.25' }],
  ['M10x1.25', { series: 'MF', size: '10', pitchMm: 1.25, designation: 'M10x1.25', key: 'M10x1.25' }],
  ['M2.5', { series: 'M', size: '2.5', pitchMm: 0.45, designation: 'M2.5', key: 'M2.5x0.45' }],
  ['M2,5', { series: 'M', size: '2.5', designation: 'M2.5', key: 'M2.5x0.45' }],
  ['M6-1', { series: 'M', size: '6', pitchMm: 1, designation: 'M6', key: 'M6x1' }],
  ['M6x0.75-6g', { series: 'MF', size: '6', pitchMm: 0.75, designation: 'M6x0.75', key: 'M6x0.75' }],
  ['M 5', { series: 'M', size: '5', pitchMm: 0.8, designation: 'M5', key: 'M5x0.8' }],
  ['1/4-20', { series: 'UNC', size: '1/4', tpi: 20, designation: '1/4-20 UNC', key: '1/4-20UNC' }],
  ['1/4" UNC', { series: 'UNC', size: '1/4', tpi: 20, designation: '1/4-20 UNC', key: '1/4-20UNC' }],
  ['1/4 unc', { series: 'UNC', size: '1/4', tpi: 20, designation: '1/4-20 UNC', key: '1/4-20UNC' }],
  ['1/4-20UNC', { series: 'UNC', size: '1/4', tpi: 20, designation: '1/4-20 UNC', key: '1/4-20UNC' }],
  ['1/4-28', { series: 'UNF', size: '1/4', tpi: 28, designation: '1/4-28 UNF', key: '1/4-28UNF' }],
  ['1/4 in UNF', { series: 'UNF', size: '1/4', tpi: 28, designation: '1/4-28 UNF', key: '1/4-28UNF' }],
  ['#4-40', { series: 'UNC', size: '#4', tpi: 40, designation: '#4-40 UNC', key: '#4-40UNC' }],
  ['4-40', { series: 'UNC', size: '#4', tpi: 40, designation: '#4-40 UNC', key: '#4-40UNC' }],
  ['No. 10-32', { series: 'UNF', size: '#10', tpi: 32, designation: '#10-32 UNF', key: '#10-32UNF' }],
  ['#10-24 UNC', { series: 'UNC', size: '#10', tpi: 24, designation: '#10-24 UNC', key: '#10-24UNC' }],
  ['10-32 UNF-2B', { series: 'UNF', size: '#10', tpi: 32, designation: '#10-32 UNF', key: '#10-32UNF' }],
  ['1-8', { series: 'UNC', size: '1', tpi: 8, designation: '1-8 UNC', key: '1-8UNC' }],
  ['1" UNF', { series: 'UNF', size: '1', tpi: 12, designation: '1-12 UNF', key: '1-12UNF' }],
  ['1-64', { series: 'UNC', size: '#1', tpi: 64, designation: '#1-64 UNC', key: '#1-64UNC' }],
  ['#0-80', { series: 'UNF', size: '#0', tpi: 80, designation: '#0-80 UNF', key: '#0-80UNF' }],
  ['3/8-24', { series: 'UNF', size: '3/8', tpi: 24, designation: '3/8-24 UNF', key: '3/8-24UNF' }],
  ['0.25-20', { series: 'UNC', size: '1/4', tpi: 20, designation: '1/4-20 UNC', key: '1/4-20UNC' }],
  ['2/8-20', { series: 'UNC', size: '1/4', tpi: 20, designation: '1/4-20 UNC', key: '1/4-20UNC' }],
  ['5/32-40 ME', { series: 'ME', size: '5/32', tpi: 40, designation: '5/32-40 ME', key: '5/32-40ME' }],
  ['5/32 x 40', { series: 'ME', size: '5/32', tpi: 40, designation: '5/32-40 ME', key: '5/32-40ME' }],
  ['5/32-40', { series: 'ME', size: '5/32', tpi: 40, designation: '5/32-40 ME', key: '5/32-40ME' }],
  ['1/4-40', { series: 'ME', size: '1/4', tpi: 40, designation: '1/4-40 ME', key: '1/4-40ME' }],
  ['1/4-32 me', { series: 'ME', size: '1/4', tpi: 32, designation: '1/4-32 ME', key: '1/4-32ME' }],
  ['3/8 x 32', { series: 'ME', size: '3/8', tpi: 32, designation: '3/8-32 ME', key: '3/8-32ME' }],
  ['1/2-32 ME', { series: 'ME', size: '1/2', tpi: 32, designation: '1/2-32 ME', key: '1/2-32ME' }],
  ['1/4 BSW', { series: 'BSW', size: '1/4', tpi: 20, designation: '1/4 BSW', key: '1/4-20BSW' }],
  ['1/4" W', { series: 'BSW', size: '1/4', tpi: 20, designation: '1/4 BSW', key: '1/4-20BSW' }],
  ['5/16 BSF', { series: 'BSF', size: '5/16', tpi: 22, designation: '5/16 BSF', key: '5/16-22BSF' }],
  ['3/16-24', { series: 'BSW', size: '3/16', tpi: 24, designation: '3/16 BSW', key: '3/16-24BSW' }],
  ['1/4-26', { series: 'BSF', size: '1/4', tpi: 26, designation: '1/4 BSF', key: '1/4-26BSF' }],
  ['3/16 bsf', { series: 'BSF', size: '3/16', tpi: 32, designation: '3/16 BSF', key: '3/16-32BSF' }],
  ['1/2 Whitworth', { series: 'BSW', size: '1/2', tpi: 12, designation: '1/2 BSW', key: '1/2-12BSW' }],
  ['1/8-40', { series: 'ME', size: '1/8', tpi: 40, designation: '1/8-40 ME', key: '1/8-40ME' }],
]

describe('parseThread: typed forms', () => {
  it(`covers at least 40 forms (${VALID.length})`, () => expect(VALID.length).toBeGreaterThanOrEqual(40))

  it.each(VALID)('reads "%s"', (typed, want) => {
    const r = parseThread(typed)
    if (!r.ok) throw new Error(r.message)
    const { designation, key, ...spec } = want
    expect(r.spec).toMatchObject(spec)
    expect(designationOf(r.spec)).toBe(designation)
    expect(keyOf(r.spec)).toBe(key)
  })

  it('notes the other series when a bare size-tpi fits two: 1/4-20 is UNC, and 1/4 BSW has the same count', () => {
    const r = parseThread('1/4-20')
    expect(r.ok && r.notes.join(' ')).toMatch(/1\/4 BSW/)
  })
})

/** [typed, a suggestion we expect, words the message must contain]. */
const INVALID: [string, string | null, RegExp][] = [
  ['17BA', '16BA', /0BA to 16BA/],
  ['25 BA', '16BA', /BS 93/],
  ['M3x0.6', 'M3', /0\.5 mm coarse.*0\.35/],
  ['M3.3', 'M3', /not an ISO 261 size/],
  ['M13', 'M12', /not an ISO 261 size/],
  ['M8x2', 'M8', /1\.25 mm coarse/],
  ['1/4-24', '1/4-28 UNF', /1\/4" with 24 tpi/],
  ['1/4', '1/4-20 UNC', /add the threads per inch or the series/],
  ['#4', '#4-40 UNC', /add the threads per inch/],
  ['1/4 ME', '1/4-40 ME', /threads per inch/],
  ['1-14 UNF', '1-12 UNF', /No UNF thread/],
  ['5/32-32 ME', '5/32-40 ME', /No ME thread/],
  ['3/16 UNC', '#10-24 UNC', /No UNC thread is 3\/16"/],
  ['1/4-20 BSF', '1/4 BSF', /No BSF thread/],
  ['#14-20', '1/4-20 UNC', /No UNC, UNF, ME, BSW or BSF thread/],
  ['7/64-40 ME', '1/8-40 ME', /No ME thread/],
  ['xyz', null, /not a thread designation we can read/],
  ['M', null, /not a thread designation/],
  ['M4x0.7x2', null, /write it like 7BA, M3/],
  ['1/0-20', null, /not a thread designation/],
  ['', null, /Give a thread designation/],
]

describe('parseThread: refusals', () => {
  it(`covers at least 15 refusals (${INVALID.length})`, () => expect(INVALID.length).toBeGreaterThanOrEqual(15))

  it.each(INVALID)('refuses "%s", suggesting %s', (typed, suggestion, words) => {
    const r = parseThread(typed)
    expect(r.ok).toBe(false)
    if (r.ok) return
    expect(r.message).toMatch(words)
    if (suggestion) {
      expect(r.suggestions).toContain(suggestion)
      expect(r.message).toContain(`Did you mean`)
    }
    if (typed.trim()) expect(r.suggestions.length).toBeGreaterThan(0)
  })
})

describe('threadKey', () => {
  it('normalises typed forms to the documented key', () => {
    expect(threadKey('7ba')).toBe('7BA')
    expect(threadKey('m3')).toBe('M3x0.5')
    expect(threadKey('M3 x 0.5')).toBe('M3x0.5')
    expect(threadKey('1/4" UNC')).toBe('1/4-20UNC')
    expect(threadKey('5/32 x 40')).toBe('5/32-40ME')
    expect(threadKey('1/4 BSW')).toBe('1/4-20BSW')
  })

  it('is null for text that is not a known thread', () => {
    expect(threadKey('M3x0.6')).toBeNull()
    expect(threadKey('stainless')).toBeNull()
  })

  it('round-trips every thread in the catalogue: parse(designation) gives back the same thread and key', () => {
    for (const t of THREAD_CATALOGUE) {
      const r = parseThread(designationOf(t))
      expect(r.ok && keyOf(r.spec)).toBe(keyOf(t))
      expect(threadKey(keyOf(t))).toBe(keyOf(t))
    }
  })

  it('gives every catalogue thread its own key', () => {
    const keys = THREAD_CATALOGUE.map(keyOf)
    expect(new Set(keys).size).toBe(keys.length)
  })
})
