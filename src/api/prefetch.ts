import { binsApi } from './bins'
import { takeEarlyBin } from './early'
import type { BinContentsDto } from '../../shared/types/stock'

/** A prefetched answer older than this is not used (the view fetches afresh). */
const FRESH_MS = 5_000

let pending: { code: string; at: number; answer: Promise<BinContentsDto> } | undefined

/**
 * Starts reading a bin's contents while the router is still loading the session and the bin
 * page's code, so the page a scanned label opens does not wait for them one after another.
 */
export function prefetchBin(code: string) {
  // The page's own URL was read by early.ts before the app's script had even loaded.
  const early = takeEarlyBin(code)
  if (early) {
    pending = { code, ...early }
    return
  }
  // Plain fetch, not request(): a signed-out visitor's 401 here must not trigger the sign-in
  // redirect while the router's own guard is sending them to /login with the right `next`.
  const answer = fetch(`/api/bins/${encodeURIComponent(code)}`, { headers: { accept: 'application/json' }, credentials: 'same-origin' })
    .then((res) => (res.ok ? res.json() as Promise<BinContentsDto> : Promise.reject(new Error(String(res.status)))))
  answer.catch(() => undefined)
  pending = { code, at: Date.now(), answer }
}

/** The prefetched contents of this bin, once, if fresh; otherwise undefined. */
export function takePrefetchedBin(code: string): Promise<BinContentsDto> | undefined {
  const p = pending
  pending = undefined
  if (!p || p.code !== code || Date.now() - p.at >= FRESH_MS) return undefined
  // Any failure is asked again through request(), for its error shape and sign-in handling.
  return p.answer.catch(() => binsApi.contents(code))
}
