import { query, request } from './http'
import type { ThreadInfo, ClearanceFit } from '../../shared/domain/threads'
import type { Drill } from '../../shared/domain/drills'
import type { Material } from '../../shared/domain/materials'
import type { BarResult, SectionShape } from '../../shared/domain/bar'
import type { CuttingInput, CuttingResult } from '../../shared/domain/cutting'
import type { CountByWeightResult } from '../../shared/domain/count-by-weight'
import type { EoqResult } from '../../shared/domain/reorder'

export type { ThreadInfo, Drill, Material, BarResult, CuttingResult, CountByWeightResult, EoqResult }

/** GET /calc/drill: a drill and whether the workshop owns it. */
export interface DrillInfo extends Drill {
  owned: boolean
}

/** GET /calc/drill-set: the drills the workshop owns. */
export interface DrillSetInfo {
  drills: Drill[]
  isDefault: boolean
  rejected: string[]
}

/** GET /calc/bar query: one size field per section (size for round, hex and square). */
export interface BarParams {
  section: SectionShape
  material?: string
  density?: number
  size?: number
  width?: number
  thickness?: number
  outside?: number
  wall?: number
  lengthMm?: number
  pricePerKg?: number
  pricePerMetre?: number
}

/** GET /calc/bar: the arithmetic plus the density used and where it came from. */
export interface BarInfo extends BarResult {
  densityKgM3: number
  material: Pick<Material, 'id' | 'name' | 'source'> | null
}

export interface CountByWeightParams {
  sampleCount: number
  sampleWeightG: number
  totalWeightG: number
  tareG?: number
  scaleResolutionG: number
}

export interface ReorderPointParams {
  dailyDemand: number
  leadTimeDays: number
  safetyStock?: number
}

export interface EoqParams {
  annualDemand: number
  orderCost: number
  holdingCostPerUnitYear: number
  packSize?: number
  workingDays?: number
}

type Params = Record<string, string | number | undefined>

export const calcApi = {
  thread: (designation: string, fit?: ClearanceFit) => request<ThreadInfo>('GET', `/calc/thread${query({ designation, fit })}`),
  drill: (name: string) => request<DrillInfo>('GET', `/calc/drill${query({ name })}`),
  drillSet: () => request<DrillSetInfo>('GET', '/calc/drill-set'),
  materials: () => request<Material[]>('GET', '/calc/materials'),
  bar: (p: BarParams) => request<BarInfo>('GET', `/calc/bar${query(p as unknown as Params)}`),
  cuttingList: (input: CuttingInput) => request<CuttingResult>('POST', '/calc/cutting-list', input),
  countByWeight: (p: CountByWeightParams) =>
    request<CountByWeightResult>('GET', `/calc/count-by-weight${query(p as unknown as Params)}`),
  reorderPoint: (p: ReorderPointParams) =>
    request<{ reorderPoint: number; leadTimeDemand: number }>('GET', `/calc/reorder-point${query(p as unknown as Params)}`),
  eoq: (p: EoqParams) => request<EoqResult>('GET', `/calc/eoq${query(p as unknown as Params)}`),
}
