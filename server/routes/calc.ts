import { Router } from 'express'
import { badRequest } from '../errors'
import { getSetting } from '../services/settings'
import {
  barQuery, countByWeightQuery, cuttingListInput, drillQuery, drillSetSetting, eoqQuery,
  reorderPointQuery, threadQuery,
} from '../../shared/schemas/calc'
import { lookupThread } from '../../shared/domain/threads'
import { defaultDrillSetNames, drillSetFromNames, parseDrill, type Drill } from '../../shared/domain/drills'
import { barStock } from '../../shared/domain/bar'
import { MATERIALS } from '../../shared/domain/materials'
import { planCuts } from '../../shared/domain/cutting'
import { countByWeight } from '../../shared/domain/count-by-weight'
import { eoq, reorderPoint } from '../../shared/domain/reorder'

/** Workshop calculators: public and read-only (the cutting list is a POST only for its body). */
export const calcRouter = Router()

/** Settings key of the workshop's drill set: a list of drill names as parseDrill reads them. */
export const DRILL_SET_SETTING = 'drillSet'

export interface WorkshopDrills {
  drills: Drill[]
  /** True while the admin has not set a drill set of the workshop's own. */
  isDefault: boolean
  /** Stored names that are not drills; shown to the admin, never used. */
  rejected: string[]
}

/** The drills the workshop owns: its setting when that holds usable drills, otherwise the default set. */
export async function workshopDrills(): Promise<WorkshopDrills> {
  const stored = drillSetSetting.safeParse(await getSetting<unknown>(DRILL_SET_SETTING, null))
  if (stored.success) {
    const own = drillSetFromNames(stored.data)
    if (own.drills.length) return { drills: own.drills, isDefault: false, rejected: own.rejected }
  }
  return { drills: drillSetFromNames(defaultDrillSetNames()).drills, isDefault: true, rejected: [] }
}

calcRouter.get('/thread', async (req, res) => {
  const q = threadQuery.parse(req.query)
  const found = lookupThread(q.designation, (await workshopDrills()).drills, q.fit)
  if (!found.ok) throw badRequest('UNKNOWN_THREAD', found.message, { suggestions: found.suggestions })
  res.json(found.thread)
})

calcRouter.get('/drill', async (req, res) => {
  const p = parseDrill(drillQuery.parse(req.query).name)
  if (!p.ok) throw badRequest('UNKNOWN_DRILL', p.message)
  const owned = (await workshopDrills()).drills.some((d) => d.name === p.drill.name)
  res.json({ ...p.drill, owned })
})

calcRouter.get('/drill-set', async (_req, res) => {
  res.json(await workshopDrills())
})

calcRouter.get('/materials', (_req, res) => {
  res.json(MATERIALS)
})

calcRouter.get('/bar', (req, res) => {
  const q = barQuery.parse(req.query)
  const material = q.material && { id: q.material.id, name: q.material.name, source: q.material.source }
  res.json({ ...barStock(q), densityKgM3: q.densityKgM3, material: material || null })
})

calcRouter.post('/cutting-list', (req, res) => {
  res.json(planCuts(cuttingListInput.parse(req.body)))
})

calcRouter.get('/count-by-weight', (req, res) => {
  res.json(countByWeight(countByWeightQuery.parse(req.query)))
})

calcRouter.get('/reorder-point', (req, res) => {
  res.json(reorderPoint(reorderPointQuery.parse(req.query)))
})

calcRouter.get('/eoq', (req, res) => {
  res.json(eoq(eoqQuery.parse(req.query)))
})
