/**
 * The reads public/early.js starts with the page, before the app's bundle has loaded: each is
 * used once (a later session load, after signing out, asks afresh).
 */
import type { BinContentsDto } from '../../shared/types/stock'
import type { SessionDto } from '../../shared/types/api'

interface EarlyReads {
  session?: Promise<SessionDto>
  bin?: { code: string; at: number; answer: Promise<BinContentsDto> }
}

const early = (): EarlyReads => (window as unknown as { binwrightEarly?: EarlyReads }).binwrightEarly ?? {}

export function takeEarlySession(): Promise<SessionDto> | undefined {
  const reads = early()
  const s = reads.session
  reads.session = undefined
  return s
}

/** The bin read started with the page, if it is for this code. */
export function takeEarlyBin(code: string): { at: number; answer: Promise<BinContentsDto> } | undefined {
  const reads = early()
  const b = reads.bin
  reads.bin = undefined
  return b && b.code === code ? b : undefined
}
