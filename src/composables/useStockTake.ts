import { computed, ref, watch } from 'vue'
import type { BinContentsDto, PlaceTreeDto } from '../../shared/types/stock'
import type { StockTakeInput } from '../../shared/schemas/stocktake'

/** One counted line of a bin: a lot on record, or a part found there. */
export interface TakeLine {
  key: string
  lotId?: number
  partId: number
  name: string
  detail: string
  unit: string
  /** The record when the bin was opened for counting. */
  recorded: number
  counted?: number
}

export interface TakeBin {
  binId: number
  code: string
  description: string
  /** Lines are loaded when the bin is opened for counting. */
  lines: TakeLine[] | null
  counted: boolean
}

export interface TakeSession {
  scope: string
  startedAt: string
  bins: TakeBin[]
}

const KEY = 'binwright.stocktake'

/** A stock-take in progress, kept on this device so a reload or a flat phone battery loses nothing. */
export function useStockTake() {
  const session = ref<TakeSession | null>(load())
  watch(session, (s) => (s ? localStorage.setItem(KEY, JSON.stringify(s)) : localStorage.removeItem(KEY)), { deep: true })

  function start(tree: PlaceTreeDto, rackId: number | 'all') {
    const racks = tree.workshops.flatMap((w) => w.racks).filter((r) => rackId === 'all' || r.id === rackId)
    const bins = racks.flatMap((r) => r.bins).filter((b) => !b.retired).sort((a, b) => a.code.localeCompare(b.code))
    session.value = {
      scope: rackId === 'all' ? 'the whole workshop' : `rack ${racks[0]?.code ?? ''}`,
      startedAt: new Date().toISOString(),
      bins: bins.map((b) => ({ binId: b.id, code: b.code, description: b.description, lines: null, counted: false })),
    }
  }

  /** Fills a bin's lines from its contents (keeping what was already typed for the same lots). */
  function open(bin: TakeBin, contents: BinContentsDto) {
    const typed = new Map((bin.lines ?? []).map((l) => [l.key, l.counted]))
    bin.lines = contents.lines.map((l) => ({
      key: `lot-${l.lotId}`, lotId: l.lotId, partId: l.partId, name: l.partName, unit: l.unit, recorded: l.quantity,
      detail: l.batchCode ? `batch ${l.batchCode}` : l.kind === 'stock' ? 'bar piece' : l.partCode,
      counted: typed.get(`lot-${l.lotId}`),
    }))
  }

  /** A counted part found in the bin that the record does not have (bar and batches need a storekeeper's receive). */
  function addFound(bin: TakeBin, part: { id: number; name: string; unit: string; kind: string }) {
    if (part.kind === 'stock' || part.kind === 'compound' || !bin.lines || bin.lines.some((l) => l.partId === part.id)) return false
    bin.lines.push({ key: `new-${part.id}`, partId: part.id, name: part.name, detail: 'found here, not on record', unit: part.unit, recorded: 0, counted: 1 })
    return true
  }

  const done = computed(() => session.value?.bins.filter((b) => b.counted).length ?? 0)
  const differences = computed(() => (session.value?.bins ?? []).filter((b) => b.counted).flatMap((b) =>
    (b.lines ?? []).filter((l) => l.counted !== undefined && Math.abs(l.counted - l.recorded) > 1e-6).map((l) => ({ bin: b, line: l }))))

  /** What POST /api/stocktake/apply takes: every counted bin, each lot with the record it was counted against. */
  function request(reason: string): StockTakeInput {
    const bins = (session.value?.bins ?? []).filter((b) => b.counted).map((b) => ({
      binId: b.binId,
      lines: (b.lines ?? []).filter((l) => l.counted !== undefined).map((l) => (l.lotId
        ? { lotId: l.lotId, expected: l.recorded, counted: l.counted! }
        : { partId: l.partId, counted: l.counted! })),
    }))
    return { bins, reason }
  }

  /** Bins whose stock moved since counting go back to "not counted", to be counted again. */
  function reopen(binIds: number[]) {
    for (const b of session.value?.bins ?? []) if (binIds.includes(b.binId)) { b.counted = false; b.lines = null }
  }

  return { session, start, open, addFound, done, differences, request, reopen, clear: () => { session.value = null } }
}

function load(): TakeSession | null {
  try {
    const s = JSON.parse(localStorage.getItem(KEY) ?? 'null')
    return s && Array.isArray(s.bins) ? s : null
  } catch {
    return null
  }
}
