import { query, request } from './http'
import type { Page } from '../../shared/types/api'
import type { BuildStatus } from '../../shared/types/domain'
import type {
  BomImportResultDto, BuildDetailDto, BuildSummaryDto, CopyLinesResultDto, CuttingPlanDto,
  ReleasePreviewDto, ReserveResultDto, ShortageDto,
} from '../../shared/types/build'
import type {
  BuildInput, BuildPatch, DrawInput, LineInput, LinePatch, ReserveInput, ReturnInput, StatusInput,
} from '../../shared/schemas/build'

export type {
  BomImportResultDto, BuildDetailDto, BuildSummaryDto, CopyLinesResultDto, CuttingPlanDto,
  ReleasePreviewDto, ReserveResultDto, ShortageDto,
}

export interface BuildListParams {
  status?: BuildStatus
  mine?: boolean
  q?: string
  page?: number
  pageSize?: number
}

/** What a draw or a return answers: the ledger rows written and the build as it now stands. */
export interface DrawResultDto {
  movements: number[]
  build: BuildDetailDto
}

const b = (id: number) => `/builds/${id}`

export const buildsApi = {
  list: (p: BuildListParams = {}) => request<Page<BuildSummaryDto>>('GET', `/builds${query({ ...p })}`),
  get: (id: number) => request<BuildDetailDto>('GET', b(id)),
  create: (input: BuildInput) => request<BuildDetailDto>('POST', '/builds', input),
  update: (id: number, input: BuildPatch) => request<BuildDetailDto>('PATCH', b(id), input),
  releasePreview: (id: number) => request<ReleasePreviewDto>('GET', `${b(id)}/release-preview`),
  setStatus: (id: number, input: StatusInput) => request<BuildDetailDto>('POST', `${b(id)}/status`, input),
  addLine: (id: number, input: LineInput) => request<BuildDetailDto>('POST', `${b(id)}/lines`, input),
  importLines: (id: number, text: string, dryRun: boolean) =>
    request<BomImportResultDto>('POST', `${b(id)}/lines/import`, { text, dryRun }),
  copyLines: (id: number, fromBuildId: number) =>
    request<CopyLinesResultDto>('POST', `${b(id)}/lines/copy`, { fromBuildId }),
  updateLine: (id: number, lineId: number, input: LinePatch) =>
    request<BuildDetailDto>('PATCH', `${b(id)}/lines/${lineId}`, input),
  removeLine: (id: number, lineId: number) => request<BuildDetailDto>('DELETE', `${b(id)}/lines/${lineId}`),
  cuttingPlan: (id: number, lineId: number) =>
    request<CuttingPlanDto>('GET', `${b(id)}/lines/${lineId}/cutting-plan`),
  reserve: (id: number, input: ReserveInput) => request<ReserveResultDto>('POST', `${b(id)}/reserve`, input),
  release: (id: number, lineId?: number) => request<BuildDetailDto>('POST', `${b(id)}/release`, lineId ? { lineId } : {}),
  draw: (id: number, input: DrawInput) => request<DrawResultDto>('POST', `${b(id)}/draw`, input),
  returnParts: (id: number, input: ReturnInput) => request<DrawResultDto>('POST', `${b(id)}/return`, input),
  shortages: (id: number) => request<Page<ShortageDto>>('GET', `${b(id)}/shortages`),
}

export const shortagesApi = {
  /** Shortages on every open build (planned and active). */
  list: (page = 1) => request<Page<ShortageDto>>('GET', `/shortages${query({ page })}`),
}
