import { mkdirSync, writeFileSync } from 'node:fs'

/** One measured figure of `npm run bench`; a goal is checked where the issue sets one. */
export interface Figure {
  figure: string
  value: number
  unit: string
  goal?: string
  pass?: boolean
}

const figures: Figure[] = []

export function record(f: Figure) {
  figures.push(f)
  const mark = f.pass === undefined ? '' : f.pass ? '  pass' : '  FAIL'
  console.log(`${f.figure.padEnd(64)} ${String(round(f.value)).padStart(10)} ${f.unit.padEnd(8)} ${f.goal ?? ''}${mark}`)
}

export function writeResults(path = 'bench/results.json') {
  mkdirSync('bench', { recursive: true })
  writeFileSync(path, JSON.stringify({ measuredAt: new Date().toISOString(), figures }, null, 2))
  console.log(`\n${figures.length} figures written to ${path}`)
}

/** Percentile of sorted-or-not samples (nearest-rank). */
export function percentile(samples: number[], p: number): number {
  const s = [...samples].sort((a, b) => a - b)
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))]
}

export const round = (n: number) => Math.round(n * 100) / 100
