import { In, IsNull, MoreThanOrEqual, Not } from 'typeorm'
import { db } from '../db'
import { Bin, Build, BuildLine, Movement, Part, StockLot } from '../entities'
import { stockTotals } from './stock-totals'
import { onOrder } from './supply'
import { listOrders } from './orders'
import { notifyConfig } from './notify-config'
import { todayIso } from './stock-guards'
import { BOM_EPSILON } from '../../shared/domain/bom'
import type { Page } from '../../shared/types/api'
import type { ExpiryLineDto, LowStockLineDto, ShortageLineDto, TodayDto, TodayList } from '../../shared/types/today'
import type { PartKind } from '../../shared/types/domain'

/** Lines shown per box on the Today screen; the count links to the whole list. */
export const TODAY_PREVIEW = 8
/** Weeks of movements in the chart: a quarter of a year. */
export const CHART_WEEKS = 12
const MS_PER_DAY = 86_400_000
const r3 = (x: number) => Math.round(x * 1000) / 1000

export async function lowStockLines(): Promise<LowStockLineDto[]> {
  const m = db().manager
  const parts = await m.find(Part, { where: { archived: false, reorderPoint: Not(0) }, order: { code: 'ASC' } })
  const totals = await stockTotals(parts.map((p) => p.id))
  const low = parts.filter((p) => p.reorderPoint > 0 && (totals.get(p.id)?.available ?? 0) <= p.reorderPoint)
  const due = await onOrder(low.map((p) => p.id))
  return low.map((p) => ({
    partId: p.id, partCode: p.code, partName: p.name, unit: p.unit, available: r3(totals.get(p.id)!.available),
    reorderPoint: p.reorderPoint, onOrder: r3(due.get(p.id) ?? 0),
  }))
}

export async function activeShortageLines(): Promise<ShortageLineDto[]> {
  const m = db().manager
  const builds = await m.find(Build, { where: { status: 'active' } })
  if (!builds.length) return []
  const lines = (await m.find(BuildLine, { where: { buildId: In(builds.map((b) => b.id)) }, order: { buildId: 'ASC', position: 'ASC' } }))
    .filter((l) => l.shortQuantity > BOM_EPSILON)
  const parts = new Map((await m.findBy(Part, { id: In(lines.map((l) => l.partId)) })).map((p) => [p.id, p]))
  const names = new Map(builds.map((b) => [b.id, b.name]))
  return lines.map((l) => {
    const p = parts.get(l.partId)
    return {
      buildId: l.buildId, buildName: names.get(l.buildId) ?? '', partId: l.partId, partCode: p?.code ?? '?',
      partName: p?.name ?? '?', unit: p?.unit ?? '', shortQuantity: r3(l.shortQuantity),
    }
  })
}

export async function expiryLines(now = new Date()): Promise<ExpiryLineDto[]> {
  const m = db().manager
  const today = todayIso(now)
  const horizon = todayIso(new Date(now.getTime() + notifyConfig().EXPIRY_WARNING_DAYS * MS_PER_DAY))
  const lots = (await m.find(StockLot, { where: { expiresOn: Not(IsNull()) }, order: { expiresOn: 'ASC' } }))
    .filter((l) => l.quantity > 0 && l.expiresOn! <= horizon)
  const parts = new Map((await m.findBy(Part, { id: In(lots.map((l) => l.partId)) })).map((p) => [p.id, p]))
  const bins = new Map((await m.findBy(Bin, { id: In(lots.map((l) => l.binId)) })).map((b) => [b.id, b.code]))
  return lots.filter((l) => !parts.get(l.partId)?.archived).map((l) => {
    const p = parts.get(l.partId)!
    return {
      lotId: l.id, partId: p.id, partCode: p.code, partName: p.name, unit: p.unit, binCode: bins.get(l.binId) ?? '?',
      batchCode: l.batchCode, expiresOn: l.expiresOn!, quantity: r3(l.quantity), expired: l.expiresOn! < today,
    }
  })
}

async function stockValueByKind() {
  const rows: { kind: PartKind; value: number }[] = await db().manager.createQueryBuilder(StockLot, 'l')
    .innerJoin(Part, 'p', 'p.id = l.partId')
    .select('p.kind', 'kind').addSelect('SUM(l.quantity * p.unitCost)', 'value')
    .where('p.archived = :no', { no: false }).groupBy('p.kind').getRawMany()
  return rows.map((r) => ({ kind: r.kind, value: Math.round(Number(r.value) * 100) / 100 })).filter((r) => r.value > 0)
}

/** Monday 00:00 local of the week holding `d`. */
function mondayOf(d: Date) {
  const x = new Date(d)
  x.setHours(0, 0, 0, 0)
  x.setDate(x.getDate() - ((x.getDay() + 6) % 7))
  return x
}

async function movementsPerWeek(now = new Date()) {
  const first = mondayOf(new Date(now.getTime() - (CHART_WEEKS - 1) * 7 * MS_PER_DAY))
  const weeks = Array.from({ length: CHART_WEEKS }, (_, i) => {
    const start = new Date(first)
    start.setDate(first.getDate() + 7 * i)
    return { weekStart: todayIso(start), receive: 0, draw: 0, other: 0 }
  })
  const moves = await db().manager.find(Movement, { where: { at: MoreThanOrEqual(first) }, select: { kind: true, at: true } })
  for (const mv of moves) {
    const w = weeks.find((x) => x.weekStart === todayIso(mondayOf(new Date(mv.at))))
    if (!w) continue
    if (mv.kind === 'receive') w.receive++
    else if (mv.kind === 'draw') w.draw++
    else w.other++
  }
  return weeks
}

export async function today(): Promise<TodayDto> {
  const [low, short, expiry, open, late] = await Promise.all([
    lowStockLines(), activeShortageLines(), expiryLines(),
    listOrders({ status: 'open', pageSize: TODAY_PREVIEW }), listOrders({ late: true, pageSize: 1 }),
  ])
  const expiredCount = expiry.filter((e) => e.expired).length
  return {
    expiryWarningDays: notifyConfig().EXPIRY_WARNING_DAYS,
    lowStock: { count: low.length, items: low.slice(0, TODAY_PREVIEW) },
    shortages: { count: short.length, items: short.slice(0, TODAY_PREVIEW) },
    expiry: { expired: expiredCount, expiring: expiry.length - expiredCount, items: expiry.slice(0, TODAY_PREVIEW) },
    orders: { open: open.total, late: late.total, items: open.items },
    charts: { stockValueByKind: await stockValueByKind(), movementsPerWeek: await movementsPerWeek() },
  }
}

/** The whole list behind one of the Today counts, a page at a time. */
export async function todayList(list: TodayList, page: number, pageSize: number): Promise<Page<unknown>> {
  if (list === 'orders') return listOrders({ status: 'open', page, pageSize })
  const all: unknown[] = list === 'low-stock' ? await lowStockLines() : list === 'shortages' ? await activeShortageLines() : await expiryLines()
  return { items: all.slice((page - 1) * pageSize, page * pageSize), total: all.length, page, pageSize }
}
