/**
 * Tapping and clearance drills as published in workshop tables and handbooks. Where sources disagree
 * every choice is kept with its source, so the user sees the disagreement rather than one "truth".
 * Keys are thread keys (see keyOf in thread-names.ts).
 */

export interface PublishedDrill {
  drill: string
  source: string
}
export interface PublishedDrills {
  tap: PublishedDrill[]
  clearance: PublishedDrill[]
  notes: string[]
}

const IBLS = 'IBLS wiki "Threads" table'
const MINISTEAM = 'ministeam.net tables'
const BRITISH_FASTENERS = 'britishfasteners.com'
const RULE_OF_4 = '"rule of 4" page'
const MH = "Machinery's Handbook 31st ed. (75 % thread)"
const OTHER_CHART = 'another tap drill chart'
const ISO_CHART = 'ISO 261/724 tap drill chart (mlc.org.uk)'
const ISO_273_FROM_MEMORY = 'ISO 273 (from memory)'

/** [thread key, tapping drills by source, clearance drills by source, notes]. */
type Row = [key: string, tap: Record<string, string[]>, clearance: Record<string, string[]>, notes?: string[]]

const BA_ROWS: Row[] = [
  ['0BA', { [IBLS]: ['#10'], [MINISTEAM]: ['5.1 mm', '#7'] }, { [IBLS]: ['C'], [MINISTEAM]: ['6.2 mm', 'D'] },
    ['Sources disagree: #10 and C (IBLS) against #7 and D (ministeam.net).']],
  ['1BA', { [IBLS]: ['#17'], [MINISTEAM]: ['4.5 mm', '#16'] }, { [IBLS]: ['#2'], [MINISTEAM]: ['5.5 mm', '#2'] }],
  ['2BA', { [IBLS]: ['#24'], [MINISTEAM]: ['4.0 mm', '#22'], [RULE_OF_4]: ['#24'] }, { [IBLS]: ['#12'], [MINISTEAM]: ['4.9 mm', '#10'] },
    ['Sources disagree on the tapping drill: #22 (4.0 mm) against #24.',
      'A forum post gives the 2BA pitch as 0.89 mm; BS 93 gives 0.81 mm.']],
  ['3BA', { [IBLS]: ['#29'], 'workshop table (from memory)': ['3.4 mm'] }, { [IBLS]: ['#19'] }],
  ['4BA', { [IBLS]: ['#32'], [BRITISH_FASTENERS]: ['3.0 mm', '#31'], [RULE_OF_4]: ['#34'] }, { [IBLS]: ['#27'] },
    ['Sources disagree on the tapping drill: #32, #31 / 3.0 mm and #34.']],
  ['5BA', { [IBLS]: ['#37'], [MINISTEAM]: ['2.65 mm', '#37'] }, { [IBLS]: ['#30'] }],
  ['6BA', { [IBLS]: ['#43'], [MINISTEAM]: ['2.3 mm'] }, { [IBLS]: ['#34'] }],
  ['7BA', { [IBLS]: ['#46'], [MINISTEAM]: ['2.05 mm', '#46'] }, { [IBLS]: ['#38'] }],
  ['8BA', { [IBLS]: ['#50'], [MINISTEAM]: ['1.8 mm', '#50'], [RULE_OF_4]: ['#54'] }, { [IBLS]: ['#43'] },
    ['The "rule of 4" gives #54 (1.40 mm), smaller than the 8BA minor diameter (1.684 mm): not usable.',
      'One handbook is reported to print "No. 50 or 1.85 mm", but #50 is 1.78 mm.']],
  ['9BA', { [IBLS]: ['#53'], [MINISTEAM]: ['1.55 mm'] }, { [IBLS]: ['#47'] }],
  ['10BA', { [IBLS]: ['#55'], [MINISTEAM]: ['1.4 mm', '#54'] }, { [IBLS]: ['#50'] }],
]

const ME_ROWS: Row[] = [
  ['1/8-40ME', { [MINISTEAM]: ['2.6 mm', '#38'] }, { [MINISTEAM]: ['3.5 mm', '#29'] }],
  ['5/32-40ME', { [MINISTEAM]: ['3.3 mm', '#30'], [IBLS]: ['#30'] }, { [MINISTEAM]: ['4.2 mm', '#19'] }],
  ['3/16-40ME', { [MINISTEAM]: ['4.1 mm', '#20'], [IBLS]: ['5/32'] }, { [MINISTEAM]: ['5.0 mm', '#9'] },
    ['Sources disagree on the tapping drill: 5/32 in (IBLS) against #20 (ministeam.net).']],
  ['7/32-40ME', { [MINISTEAM]: ['5.0 mm', '#9'], [IBLS]: ['3/16'] }, { [MINISTEAM]: ['5.8 mm', '#1'] }],
  ['1/4-40ME', { [MINISTEAM]: ['5.8 mm', '#1'], [IBLS]: ['7/32'] }, { [MINISTEAM]: ['6.6 mm', 'G'] },
    ['Sources disagree on the tapping drill: 7/32 in (IBLS, about 98 % thread) against 5.8 mm / #1 (ministeam.net, about 68 %).']],
  ['9/32-32ME', { [MINISTEAM]: ['6.35 mm', 'E'] }, { [MINISTEAM]: ['7.5 mm', 'M'] }],
  ['5/16-32ME', { [MINISTEAM]: ['7.15 mm', '9/32'], [IBLS]: ['J'] }, { [MINISTEAM]: ['8.2 mm', 'P'] }],
  ['3/8-32ME', { [MINISTEAM]: ['8.75 mm', '11/32'], [IBLS]: ['Q'] }, { [MINISTEAM]: ['9.8 mm', 'W'] }],
  ['3/8-40ME', { [IBLS]: ['11/32'] }, {}],
]

const UN_ROWS: Row[] = [
  ['#4-40UNC', { [MH]: ['#43'] }, {}], ['#6-32UNC', { [MH]: ['#36'], [OTHER_CHART]: ['#35'] }, {},
    ['Sources disagree on the tapping drill: #36 (Machinery\'s Handbook) against #35 (one chart).']],
  ['#8-32UNC', { [MH]: ['#29'] }, {}], ['#10-24UNC', { [MH]: ['#25'] }, {}], ['#10-32UNF', { [MH]: ['#21'] }, {}],
  ['#12-24UNC', { [MH]: ['#16'] }, {}], ['#12-28UNF', { [MH]: ['#14'] }, {}], ['1/4-20UNC', { [MH]: ['#7'] }, {}],
  ['1/4-28UNF', { [MH]: ['#3'] }, {}], ['5/16-18UNC', { [MH]: ['F'] }, {}],
  ['5/16-24UNF', { 'tap drill chart': ['I'], [OTHER_CHART]: ['17/64'] }, {}, ['Charts disagree: letter I against 17/64 in.']],
  ['3/8-16UNC', { [MH]: ['5/16'] }, {}], ['3/8-24UNF', { [MH]: ['Q'] }, {}], ['7/16-14UNC', { [MH]: ['U'] }, {}],
  ['7/16-20UNF', { [MH]: ['25/64'] }, {}], ['1/2-13UNC', { [MH]: ['27/64'] }, {}], ['1/2-20UNF', { [MH]: ['29/64'] }, {}],
  ['1-12UNF', {}, {}, ['ASME B1.1 gives 1-12 UNF; "1-14" in some charts is the UNS series.']],
]

const iso = (key: string, tap: string, clear?: [string, string, string]): Row =>
  [key, { [ISO_CHART]: [tap] }, clear ? { [`${ISO_273_FROM_MEMORY}, fine`]: [clear[0]], [`${ISO_273_FROM_MEMORY}, medium`]: [clear[1]], [`${ISO_273_FROM_MEMORY}, coarse`]: [clear[2]] } : {}]

const ISO_ROWS: Row[] = [
  iso('M2x0.4', '1.6 mm'), iso('M3x0.5', '2.5 mm', ['3.2 mm', '3.4 mm', '3.6 mm']),
  iso('M4x0.7', '3.3 mm', ['4.3 mm', '4.5 mm', '4.8 mm']), iso('M5x0.8', '4.2 mm', ['5.3 mm', '5.5 mm', '5.8 mm']),
  iso('M6x1', '5.0 mm', ['6.4 mm', '6.6 mm', '7.0 mm']), iso('M8x1.25', '6.8 mm', ['8.4 mm', '9.0 mm', '10 mm']),
  iso('M10x1.5', '8.5 mm', ['10.5 mm', '11 mm', '12 mm']), iso('M12x1.75', '10.2 mm'),
  iso('M8x1', '7.0 mm'), iso('M10x1.25', '8.8 mm'), iso('M12x1.5', '10.5 mm'),
]

const flatten = (byName: Record<string, string[]>): PublishedDrill[] =>
  Object.entries(byName).flatMap(([source, drills]) => drills.map((drill) => ({ drill, source })))

export const PUBLISHED_DRILLS: Readonly<Record<string, PublishedDrills>> = Object.fromEntries(
  [...BA_ROWS, ...ME_ROWS, ...UN_ROWS, ...ISO_ROWS].map(([key, tap, clearance, notes]) =>
    [key, { tap: flatten(tap), clearance: flatten(clearance), notes: notes ?? [] }]),
)
