import { describe, expect, it } from 'vitest'
import { parsePartQuery, type PartQuery } from '../../../shared/domain/part-query'
import { canonicalMaterial, correctWord, editDistance } from '../../../shared/domain/part-query-words'

/**
 * What people in a model-engineering stores type, and what the search must understand.
 * Thread keys follow shared/domain/thread-names keyOf; inch sizes are exact (25.4 mm per inch).
 */
const FORMS: [string, PartQuery][] = [
  // threads with a fastener type (BS 93 BA, ISO 261 metric, ME, Unified)
  ['7ba nut', { kind: 'fastener', form: 'nut', threadKey: '7BA', text: '' }],
  ['7BA nut', { kind: 'fastener', form: 'nut', threadKey: '7BA', text: '' }],
  ['7 BA nuts', { kind: 'fastener', form: 'nut', threadKey: '7BA', text: '' }],
  ['nut 7ba', { kind: 'fastener', form: 'nut', threadKey: '7BA', text: '' }],
  ['ba7', { kind: 'fastener', threadKey: '7BA', text: '' }],
  ['7 BA studs 20 brass', { kind: 'fastener', form: 'stud', threadKey: '7BA', lengthMm: 20, material: 'brass', text: '' }],
  ['m3 x 12 stainless', { kind: 'fastener', threadKey: 'M3x0.5', lengthMm: 12, material: 'stainless', text: '' }],
  ['m3x12', { kind: 'fastener', threadKey: 'M3x0.5', lengthMm: 12, text: '' }],
  ['M3', { kind: 'fastener', threadKey: 'M3x0.5', text: '' }],
  ['m3 x 0.5 x 12', { kind: 'fastener', threadKey: 'M3x0.5', lengthMm: 12, text: '' }],
  ['M3×0,5', { kind: 'fastener', threadKey: 'M3x0.5', text: '' }],
  ['M4x0.5', { kind: 'fastener', threadKey: 'M4x0.5', text: '' }],
  ['m6', { kind: 'fastener', threadKey: 'M6x1', text: '' }],
  ['hex nut m4', { kind: 'fastener', form: 'nut', threadKey: 'M4x0.7', text: 'hex' }],
  ['stainless 303 m3 nut', { kind: 'fastener', form: 'nut', threadKey: 'M3x0.5', material: 'stainless 303', text: '' }],
  ['5/32-40 stud', { kind: 'fastener', form: 'stud', threadKey: '5/32-40ME', text: '' }],
  ['5/32 x 40 me', { kind: 'fastener', threadKey: '5/32-40ME', text: '' }],
  ['1/4 unc', { kind: 'fastener', threadKey: '1/4-20UNC', text: '' }],
  ['1/4 bsw', { kind: 'fastener', threadKey: '1/4-20BSW', text: '' }],
  ['1/4 whit bolt', { kind: 'fastener', form: 'bolt', threadKey: '1/4-20BSW', text: '' }],
  ['#4-40 screw', { kind: 'fastener', form: 'screw', threadKey: '#4-40UNC', text: '' }],
  ['4-40', { kind: 'fastener', threadKey: '#4-40UNC', text: '' }],
  ['1/4" bsw bolt 1" long', { kind: 'fastener', form: 'bolt', threadKey: '1/4-20BSW', lengthMm: 25.4, text: '' }],
  ['7ba stud 1/2', { kind: 'fastener', form: 'stud', threadKey: '7BA', lengthMm: 12.7, text: '' }],
  // an inch size without tpi or series
  ['1/4 nut', { kind: 'fastener', form: 'nut', threadSize: '1/4', text: '' }],
  ['1/4', { threadSize: '1/4', sizeMm: 6.35, text: '' }],
  // bar stock: section, size, material (inch sizes converted exactly)
  ['brass hex 1/4', { kind: 'stock', form: 'hex', sizeMm: 6.35, material: 'brass', text: '' }],
  ['3/8 round bms', { kind: 'stock', form: 'round', sizeMm: 9.525, material: 'mild steel', text: '' }],
  ['3/16 rd gm', { kind: 'stock', form: 'round', sizeMm: 4.762, material: 'gunmetal', text: '' }],
  ['pb round 16', { kind: 'stock', form: 'round', sizeMm: 16, material: 'phosphor bronze', text: '' }],
  ['copper tube 15 od', { kind: 'stock', form: 'tube', sizeMm: 15, material: 'copper', text: '' }],
  ['12 dia silver steel', { sizeMm: 12, material: 'silver steel', text: '' }],
  ['ss 316 bar 10', { kind: 'stock', sizeMm: 10, material: 'stainless 316', text: '' }],
  ['25 x 6 flat bms', { kind: 'stock', form: 'flat', sizeMm: 25, material: 'mild steel', text: '6' }],
  ['0.25" round', { kind: 'stock', form: 'round', sizeMm: 6.35, text: '' }],
  ['bright mild steel square 12mm', { kind: 'stock', form: 'square', sizeMm: 12, material: 'mild steel', text: '' }],
  ['round nut', { kind: 'fastener', form: 'nut', text: 'round' }],
  // gaskets and compounds
  ['gasket 0.4', { kind: 'gasket', sizeMm: 0.4, text: '' }],
  ['0.4mm gaskets', { kind: 'gasket', sizeMm: 0.4, text: '' }],
  ['gasket paper', { material: 'gasket paper', text: '' }],
  ['thread locker', { kind: 'compound', text: 'thread locker' }],
  ['thread-locker', { kind: 'compound', text: 'thread locker' }],
  ['retaining compound', { kind: 'compound', text: 'retaining compound' }],
  ['steam oil', { kind: 'compound', text: 'steam oil' }],
  // typing errors near a trade word
  ['studd', { kind: 'fastener', form: 'stud', text: '', corrections: [{ from: 'studd', to: 'stud' }] }],
  ['bras', { material: 'brass', text: '', corrections: [{ from: 'bras', to: 'brass' }] }],
  ['washr', { kind: 'fastener', form: 'washer', text: '', corrections: [{ from: 'washr', to: 'washer' }] }],
  ['gaskt 0.25 paper', { kind: 'gasket', sizeMm: 0.25, text: 'paper', corrections: [{ from: 'gaskt', to: 'gasket' }] }],
  // words left for fuzzy ranking
  ['coil spring', { text: 'coil spring' }],
  ['gm casting', { material: 'gunmetal', text: 'casting' }],
  ['whistle valve', { text: 'whistle valve' }],
  ['', { text: '' }],
]

describe('parsePartQuery', () => {
  it.each(FORMS)('reads %j', (typed, expected) => {
    expect(parsePartQuery(typed)).toEqual(expected)
  })

  it('covers at least 40 typed forms', () => {
    expect(FORMS.length).toBeGreaterThanOrEqual(40)
  })

  it('gives 7ba, 7BA and 7 BA the same thread key, and M3 the key of M3x0.5', () => {
    const keys = ['7ba', '7BA', '7 BA'].map((t) => parsePartQuery(t).threadKey)
    expect(new Set(keys)).toEqual(new Set(['7BA']))
    expect(parsePartQuery('M3').threadKey).toBe(parsePartQuery('M3x0.5').threadKey)
  })

  it('leaves a designation that is no thread (17BA) to the text rather than guessing', () => {
    expect(parsePartQuery('17ba nut')).toEqual({ kind: 'fastener', form: 'nut', text: '17ba' })
  })
})

describe('material names', () => {
  it.each([
    ['BMS', 'mild steel'], ['Bright mild steel', 'mild steel'], ['Stainless steel 303', 'stainless 303'],
    ['stainless A2', 'stainless a2'], ['PB', 'phosphor bronze'], ['GM LG2', 'gunmetal lg2'],
    ['Cu', 'copper'], ['Brass', 'brass'], ['mild steel, zinc plated', 'mild steel, zinc plated'],
    ['Delrin', 'delrin'],
  ])('files %j under %j', (typed, canonical) => {
    expect(canonicalMaterial(typed)).toBe(canonical)
  })
})

describe('typing errors', () => {
  it('counts a swapped pair of letters as one error', () => {
    expect(editDistance('bras', 'brass')).toBe(1)
    expect(editDistance('sutd', 'stud')).toBe(1)
    expect(editDistance('coil', 'oil', 1)).toBe(1)
  })

  it('corrects only words of four letters or more, and never towards a three-letter word', () => {
    expect(correctWord('studd')).toBe('stud')
    expect(correctWord('coil')).toBeUndefined()
    expect(correctWord('nit')).toBeUndefined()
  })
})
