import { In, IsNull, Not, type EntityManager } from 'typeorm'
import { db, inTransaction, stockEvents } from '../db'
import { Alert, Bin, Part, StockLot } from '../entities'
import { stockTotals } from './stock-totals'
import { openShortages } from './shortages'
import { todayIso } from './stock-guards'
import { notifyConfig } from './notify-config'
import type { AlertKind } from '../../shared/types/domain'
import type { Page } from '../../shared/types/api'
import type { AlertDto } from '../../shared/types/alert'

/** Ids per IN (…) list: well under SQLite's bound-parameter limit. */
const CHUNK = 400
const MS_PER_DAY = 86_400_000
/** Alert.message column width. */
const MESSAGE_MAX = 300

interface Condition {
  kind: AlertKind
  key: string
  partId: number
  lotId: number | null
  buildId: number | null
  message: string
}

const n = (x: number) => String(Math.round(x * 1000) / 1000)
const chunks = <T>(xs: T[]) => Array.from({ length: Math.ceil(xs.length / CHUNK) }, (_, i) => xs.slice(i * CHUNK, (i + 1) * CHUNK))

/** Everything that should be alerting now for these parts. */
async function conditionsFor(tx: EntityManager, partIds: number[], now: Date): Promise<Condition[]> {
  const parts = await tx.findBy(Part, { id: In(partIds), archived: false })
  if (!parts.length) return []
  const live = parts.map((p) => p.id)
  const totals = await stockTotals(live, tx)
  const out: Condition[] = []
  for (const p of parts) {
    const available = totals.get(p.id)?.available ?? 0
    if (p.reorderPoint > 0 && available <= p.reorderPoint) {
      out.push({ kind: 'low-stock', key: `low-stock:${p.id}`, partId: p.id, lotId: null, buildId: null,
        message: `${p.code} ${p.name}: ${n(available)} ${p.unit} available, reorder point ${n(p.reorderPoint)}` })
    }
  }
  const byId = new Map(parts.map((p) => [p.id, p]))
  out.push(...await expiryConditions(tx, live, byId, now))
  for (const s of (await openShortages()).filter((x) => byId.has(x.partId))) {
    const p = byId.get(s.partId)!
    out.push({ kind: 'shortage', key: `shortage:${s.lineId}`, partId: p.id, lotId: null, buildId: s.buildId,
      message: `${s.buildName} is short of ${n(s.shortQuantity)} ${p.unit} of ${p.code} ${p.name}` })
  }
  return out
}

async function expiryConditions(tx: EntityManager, partIds: number[], parts: Map<number, Part>, now: Date) {
  const today = todayIso(now)
  const horizon = todayIso(new Date(now.getTime() + notifyConfig().EXPIRY_WARNING_DAYS * MS_PER_DAY))
  const lots = (await tx.findBy(StockLot, { partId: In(partIds), expiresOn: Not(IsNull()) }))
    .filter((l) => l.quantity > 0 && l.expiresOn! <= horizon)
  const bins = new Map((await tx.findBy(Bin, { id: In([...new Set(lots.map((l) => l.binId))]) })).map((b) => [b.id, b.code]))
  return lots.map((l): Condition => {
    const p = parts.get(l.partId)!
    const expired = l.expiresOn! < today
    const where = `${p.code} ${p.name}, batch ${l.batchCode ?? '?'} in ${bins.get(l.binId) ?? '?'} (${n(l.quantity)} ${p.unit})`
    return {
      kind: expired ? 'expired' : 'expiring', key: `${expired ? 'expired' : 'expiring'}:${l.id}`,
      partId: p.id, lotId: l.id, buildId: null,
      message: `${where}: ${expired ? 'expired on' : 'expires on'} ${l.expiresOn}`,
    }
  })
}

/**
 * Brings the alerts of these parts up to date: a new condition opens one alert (its key is
 * unique among open alerts, so a condition alerts once), a condition gone resolves its alert.
 */
export async function refreshAlerts(partIds: number[], now = new Date()): Promise<void> {
  for (const chunk of chunks([...new Set(partIds)])) await inTransaction((tx) => refreshChunk(tx, chunk, now))
}

async function refreshChunk(tx: EntityManager, chunk: number[], now: Date) {
  const wanted = new Map((await conditionsFor(tx, chunk, now)).map((c) => [c.key, c]))
  const open = await tx.findBy(Alert, { partId: In(chunk), resolvedAt: IsNull() })
  const stamp = now.toISOString()
  for (const a of open) {
    const c = wanted.get(a.key)
    if (!c) await tx.update(Alert, { id: a.id }, { resolvedAt: stamp })
    else if (c.message.slice(0, MESSAGE_MAX) !== a.message) await tx.update(Alert, { id: a.id }, { message: c.message.slice(0, MESSAGE_MAX) })
    wanted.delete(a.key)
  }
  for (const c of wanted.values()) {
    await tx.insert(Alert, { ...c, message: c.message.slice(0, MESSAGE_MAX), resolvedAt: null, emailedAt: null })
  }
}

/** Every part at once: at start-up and in the hourly sweep (expiry dates move on by themselves). */
export async function refreshAllAlerts(now = new Date()): Promise<void> {
  const ids = (await db().manager.find(Part, { select: { id: true } })).map((p) => p.id)
  const orphans = await db().manager.find(Alert, { where: { resolvedAt: IsNull(), partId: Not(In(ids.length ? ids : [0])) }, select: { id: true } })
  if (orphans.length) {
    await inTransaction((tx) => tx.update(Alert, { id: In(orphans.map((a) => a.id)) }, { resolvedAt: now.toISOString() }))
  }
  await refreshAlerts(ids, now)
}

const pending = new Set<Promise<unknown>>()
let listener: ((ids: number[]) => void) | undefined

/** Tracks background work so reads and tests can wait for it (settle()). */
export function track(work: Promise<unknown>): Promise<void> {
  const p = work.then(() => undefined, (err) => { console.error('alerts: refresh failed', err) })
  pending.add(p)
  void p.finally(() => pending.delete(p))
  return p
}

/** Parts changed since the queued refresh was started; undefined when none is queued. */
let waiting: Set<number> | undefined

/**
 * Follows every committed stock or reservation change (stockEvents from server/db). Changes
 * that commit while a refresh waits for its turn in the write queue join that refresh, so a
 * burst of 200 reservations costs one or two refreshes, not 200 turns of the queue.
 */
export function watchStockForAlerts() {
  if (listener) stockEvents.off('stock-changed', listener)
  waiting = undefined
  listener = (ids: number[]) => {
    if (waiting) {
      for (const id of ids) waiting.add(id)
      return
    }
    const batch = new Set(ids)
    waiting = batch
    void track(inTransaction(async (tx) => {
      // From its turn on, new changes start a new refresh: this one may already have read them.
      if (waiting === batch) waiting = undefined
      const all = [...batch]
      await refreshChunk(tx, all.slice(0, CHUNK), new Date())
      return all.slice(CHUNK)
    }).then((rest) => refreshAlerts(rest)))
  }
  stockEvents.on('stock-changed', listener)
}

/** Resolves once every refresh started so far has finished. */
export async function settle(): Promise<void> {
  while (pending.size) await Promise.all([...pending])
}

export interface AlertFilter {
  open: boolean
  kind?: AlertKind
  page: number
  pageSize: number
}

/** Alerts, newest first, with their parts' codes; waits for refreshes still running. */
export async function listAlerts(f: AlertFilter): Promise<Page<AlertDto>> {
  await settle()
  const m = db().manager
  const where = { ...(f.open ? { resolvedAt: IsNull() } : {}), ...(f.kind ? { kind: f.kind } : {}) }
  const [rows, total] = await m.findAndCount(Alert, { where, order: { id: 'DESC' }, skip: (f.page - 1) * f.pageSize, take: f.pageSize })
  const parts = new Map((await m.findBy(Part, { id: In(rows.map((a) => a.partId ?? 0)) })).map((p) => [p.id, p]))
  const items = rows.map((a): AlertDto => {
    const p = parts.get(a.partId ?? 0)
    return {
      id: a.id, kind: a.kind, key: a.key, partId: a.partId, partCode: p?.code ?? '', partName: p?.name ?? '', unit: p?.unit ?? '',
      lotId: a.lotId, buildId: a.buildId, message: a.message, openedAt: new Date(a.openedAt).toISOString(),
      resolvedAt: a.resolvedAt, emailedAt: a.emailedAt,
    }
  })
  return { items, total, page: f.page, pageSize: f.pageSize }
}
