/**
 * Client weight: the JS and CSS (gzip) a browser must fetch before the sign-in page and the bin
 * page can show, followed through the Vite manifest: the entry's static imports, then the
 * route's lazy chunk and its static imports. Builds the client into a private folder, which the
 * later browser suites then serve (CLIENT_DIR), so they measure this very build.
 */
import { execFileSync } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { gzipSync } from 'node:zlib'
import { record } from '../harness'

const OUT_DIR = '.tmp/bench-dist'
/** The goal for each page's initial JS. */
const JS_GOAL_KB = 300

interface Chunk { file: string; css?: string[]; imports?: string[]; isEntry?: boolean; src?: string }
type Manifest = Record<string, Chunk>

/** Every chunk loaded with `keys`, following static imports only (dynamic ones load later). */
function closure(manifest: Manifest, keys: string[]): Set<string> {
  const seen = new Set<string>()
  const visit = (k: string) => {
    if (seen.has(k)) return
    seen.add(k)
    for (const i of manifest[k].imports ?? []) visit(i)
  }
  keys.forEach(visit)
  return seen
}

function gzipKb(files: Set<string>): number {
  let bytes = 0
  for (const f of files) bytes += gzipSync(readFileSync(join(OUT_DIR, f)), { level: 9 }).length
  return bytes / 1024
}

function weigh(manifest: Manifest, view: string) {
  const entry = Object.keys(manifest).find((k) => manifest[k].isEntry)!
  const chunks = closure(manifest, [entry, `src/views/${view}.vue`])
  const js = new Set([...chunks].map((k) => manifest[k].file))
  const css = new Set([...chunks].flatMap((k) => manifest[k].css ?? []))
  return { js: gzipKb(js), css: gzipKb(css), files: js.size }
}

export const clientBundleSuite = {
  name: 'client: initial JS and CSS (gzip) of the sign-in page and the bin page',
  async run() {
    const t0 = performance.now()
    execFileSync(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--outDir', OUT_DIR, '--emptyOutDir', '--logLevel', 'warn'], { stdio: 'inherit' })
    record({ figure: 'vite build', value: performance.now() - t0, unit: 'ms' })
    process.env.CLIENT_DIR = OUT_DIR
    const manifest = JSON.parse(readFileSync(join(OUT_DIR, '.vite/manifest.json'), 'utf8')) as Manifest
    for (const [label, view] of [['sign-in page', 'LoginView'], ['bin page', 'BinDetailView']]) {
      const w = weigh(manifest, view)
      record({ figure: `${label}: initial JS, gzip (${w.files} files)`, value: w.js, unit: 'KiB', goal: `≤ ${JS_GOAL_KB} KB`, pass: w.js <= JS_GOAL_KB })
      record({ figure: `${label}: initial CSS, gzip`, value: w.css, unit: 'KiB' })
    }
  },
}
