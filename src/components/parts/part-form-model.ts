/** The part form's model: common fields plus one attribute set per kind, so switching kind loses nothing. */
import { reactive } from 'vue'
import type { PartKind } from '../../../shared/types/domain'
import type { PartInput } from '../../../shared/schemas/part'
import type { PartDetailDto } from '../../../shared/types/part'

export type AttributeSets = Record<PartKind, Record<string, unknown>>

/** Fields of each kind, in form order (the same names the zod schemas use). */
export const KIND_FIELDS: Record<PartKind, string[]> = {
  fastener: ['type', 'thread', 'lengthMm', 'material', 'finish', 'head', 'drive'],
  gasket: ['material', 'thicknessMm', 'innerMm', 'outerMm', 'shape'],
  stock: ['material', 'section', 'sizeMm', 'thicknessMm', 'wallMm'],
  compound: ['grade', 'containerSize', 'hazardous'],
  other: ['properties'],
}

export const COMMON_FIELDS = ['name', 'code', 'unit', 'notes', 'tags', 'reorderPoint', 'reorderQuantity', 'unitCost'] as const

const blankSets = (): AttributeSets => ({
  fastener: { type: 'stud', thread: '', lengthMm: null, material: '', finish: '', head: '', drive: '' },
  gasket: { material: '', thicknessMm: null, innerMm: null, outerMm: null, shape: '' },
  stock: { material: '', section: 'round', sizeMm: null, thicknessMm: null, wallMm: null },
  compound: { grade: '', containerSize: '', hazardous: false },
  other: { properties: [] as { key: string; value: string }[] },
})

export function partFormModel(part?: PartDetailDto) {
  const attrs = blankSets()
  if (part) {
    const a = { ...part.attributes }
    if (part.kind === 'other') a.properties = Object.entries((a.properties ?? {}) as Record<string, string>).map(([key, value]) => ({ key, value }))
    Object.assign(attrs[part.kind], a)
  }
  return reactive({
    kind: (part?.kind ?? 'fastener') as PartKind,
    name: part?.name ?? '',
    code: part?.code ?? '',
    unit: part?.unit ?? '',
    notes: part?.notes ?? '',
    tags: [...(part?.tags ?? [])],
    reorderPoint: part?.reorderPoint ?? 0,
    reorderQuantity: part?.reorderQuantity ?? 0,
    unitCost: part?.unitCost ?? 0,
    pressureBearing: part?.pressureBearing ?? false,
    preferredSupplierId: part?.preferredSupplierId ?? null,
    attrs,
  })
}
export type PartFormModel = ReturnType<typeof partFormModel>

/** The attributes of the chosen kind as the API takes them: blanks left out, numbers as numbers. */
export function attributesOf(m: PartFormModel): Record<string, unknown> {
  const out: Record<string, unknown> = { kind: m.kind }
  for (const [k, v] of Object.entries(m.attrs[m.kind])) {
    if (k === 'kind' || v === '' || v === null || v === undefined) continue
    out[k] = k === 'properties'
      ? Object.fromEntries((v as { key: string; value: string }[]).filter((p) => p.key.trim()).map((p) => [p.key.trim(), p.value]))
      : v
  }
  return out
}

/** The whole form as POST/PATCH /api/parts takes it. */
export function inputOf(m: PartFormModel): PartInput {
  return {
    code: m.code.trim() || undefined,
    name: m.name,
    unit: m.unit.trim() || undefined,
    notes: m.notes,
    tags: m.tags,
    reorderPoint: m.reorderPoint ?? 0,
    reorderQuantity: m.reorderQuantity ?? 0,
    unitCost: m.unitCost ?? 0,
    pressureBearing: m.pressureBearing,
    preferredSupplierId: m.preferredSupplierId,
    attributes: attributesOf(m) as PartInput['attributes'],
  }
}
