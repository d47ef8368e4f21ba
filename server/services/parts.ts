import { Not, type EntityManager } from 'typeorm'
import { Part } from '../entities'
import { badRequest, conflict } from '../errors'
import { newLabelCode } from './codes'
import { partsChanged } from './part-search-index'
import { partInput, type PartAttributes, type PartInput, type PartInputParsed } from '../../shared/schemas/part'
import { stockModeOf } from '../../shared/types/domain'
import { designationOf, keyOf, parseThread } from '../../shared/domain/threads'
import { canonicalMaterial, materialCode } from '../../shared/domain/part-query-words'

/** The material column holds 40 characters (see the Part entity). */
const MATERIAL_COLUMN_LENGTH = 40
/** Part codes hold 48 characters (see the Part entity and partInput). */
const CODE_LENGTH = 48

const material = (m: string) => canonicalMaterial(m).slice(0, MATERIAL_COLUMN_LENGTH)

/** Search columns copied out of the kind-specific attributes (see the Part entity). */
export function derivePartColumns(a: PartAttributes) {
  switch (a.kind) {
    case 'fastener': {
      const p = parseThread(a.thread)
      return { form: a.type, threadKey: p.ok ? keyOf(p.spec) : null, lengthMm: a.lengthMm ?? null, sizeMm: null, material: material(a.material) }
    }
    case 'gasket':
      return { form: null, threadKey: null, lengthMm: null, sizeMm: a.thicknessMm, material: material(a.material) }
    case 'stock':
      return { form: a.section, threadKey: null, lengthMm: null, sizeMm: a.sizeMm, material: material(a.material) }
    case 'compound':
      return { form: null, threadKey: null, lengthMm: null, sizeMm: null, material: null }
    default: {
      // Free attributes may still name a material ("gunmetal LG2" castings): index it too.
      const m = Object.entries(a.properties).find(([k]) => k.trim().toLowerCase() === 'material')?.[1]
      return { form: null, threadKey: null, lengthMm: null, sizeMm: null, material: m ? material(m) : null }
    }
  }
}

/**
 * Checks a fastener's thread with the Workbench parser and writes it the standard way
 * ("7ba" → "7BA", "m4 x 0.5" → "M4x0.5"); an unknown designation is a 400 naming the field.
 */
export function checkedAttributes(a: PartAttributes): PartAttributes {
  if (a.kind !== 'fastener') return a
  const p = parseThread(a.thread)
  if (!p.ok) {
    throw badRequest('INVALID_INPUT', `attributes.thread: ${p.message}`,
      [{ path: 'attributes.thread', message: p.message, suggestions: p.suggestions }])
  }
  return { ...a, thread: designationOf(p.spec) }
}

const DEFAULT_UNIT = { count: 'pcs', length: 'mm', batch: 'each' } as const

/** Creates a part inside the caller's transaction; without a code, the suggested one is used. */
export async function createPart(tx: EntityManager, raw: PartInput): Promise<Part> {
  const input = partInput.parse(raw)
  const attributes = checkedAttributes(input.attributes)
  const code = input.code ?? await freeCode(tx, suggestPartCode(attributes, input.name))
  await ensureCodeFree(tx, code)
  const part = await tx.save(Part, tx.create(Part, {
    ...input,
    attributes,
    code,
    kind: attributes.kind,
    unit: input.unit ?? DEFAULT_UNIT[stockModeOf(attributes.kind)],
    ...derivePartColumns(attributes),
    labelCode: newLabelCode('P'),
  }))
  partsChanged([part.id])
  return part
}

/** Replaces a part's fields (the edit form sends the whole part); the code stays when omitted. */
export async function updatePart(tx: EntityManager, part: Part, raw: PartInput, locked: { kindLocked: boolean }): Promise<Part> {
  const input: PartInputParsed = partInput.parse(raw)
  const attributes = checkedAttributes(input.attributes)
  if (attributes.kind !== part.kind && locked.kindLocked) {
    throw conflict('KIND_LOCKED', `${part.code} already has stock or ledger movements, so its kind (${part.kind}) cannot change.`)
  }
  const code = input.code ?? part.code
  await ensureCodeFree(tx, code, part.id)
  tx.merge(Part, part, {
    ...input,
    attributes,
    code,
    kind: attributes.kind,
    unit: input.unit ?? part.unit,
    ...derivePartColumns(attributes),
  })
  const saved = await tx.save(Part, part)
  partsChanged([saved.id])
  return saved
}

async function ensureCodeFree(tx: EntityManager, code: string, exceptId?: number) {
  const taken = await tx.existsBy(Part, exceptId ? { code, id: Not(exceptId) } : { code })
  if (taken) throw conflict('CODE_TAKEN', `The part code ${code} is already used by another part.`, { field: 'code' })
}

/** `base`, or base-2, base-3 … when taken: a suggestion the user can accept as it is. */
export async function freeCode(tx: EntityManager, base: string, exceptId?: number): Promise<string> {
  for (let n = 1; ; n++) {
    const suffix = n === 1 ? '' : `-${n}`
    const code = base.slice(0, CODE_LENGTH - suffix.length) + suffix
    const taken = await tx.existsBy(Part, exceptId ? { code, id: Not(exceptId) } : { code })
    if (!taken) return code
  }
}

const words = (s: string, max: number) => s.replace(/[^a-z0-9]/gi, '').slice(0, max).toUpperCase()
/** Numbers in codes as typed: 6.35 → "6.35", 12 → "12". */
const num = (n: number | null | undefined) => (n === null || n === undefined ? undefined : String(Number(n.toFixed(3))))

/** Suggests a code from the attributes: "7BA-STUD-12-BR", "M3-SCREW-12-SSA2", "HEX-6.35-BR", "GSK-0.4-FIB". */
export function suggestPartCode(a: PartAttributes, name: string): string {
  const thread = (t: string) => {
    const p = parseThread(t)
    return (p.ok ? designationOf(p.spec) : t).replace(/#/g, 'NO').replace(/\s+/g, '').toUpperCase()
  }
  const parts: (string | undefined)[] =
    a.kind === 'fastener' ? [thread(a.thread), a.type.toUpperCase(), num(a.lengthMm), materialCode(a.material)]
      : a.kind === 'stock' ? [a.section.toUpperCase(), num(a.sizeMm), materialCode(a.material)]
        : a.kind === 'gasket' ? ['GSK', num(a.thicknessMm), materialCode(a.material)]
          : [a.kind.slice(0, 3).toUpperCase(), words(name, 12)]
  return parts.filter((p) => p).join('-').replace(/[^A-Z0-9./-]/g, '').slice(0, CODE_LENGTH)
}
