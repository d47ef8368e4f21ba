/** Links from a part into the Workbench calculators, prefilled with its attributes. */
import { findMaterial } from '../../../shared/domain/materials'
import { SECTION_SHAPES } from '../../../shared/domain/bar'
import type { PartDetailDto } from '../../../shared/types/part'

export interface WorkbenchLink {
  label: string
  to: string
}

const qs = (params: Record<string, string | number | undefined | null>) =>
  new URLSearchParams(Object.entries(params).filter(([, v]) => v !== undefined && v !== null && v !== '').map(([k, v]) => [k, String(v)])).toString()

/** The bar calculator's size fields for a section: diameter, width × thickness, or outside × wall. */
function barSize(section: string, a: Record<string, unknown>) {
  if (section === 'flat') return { width: a.sizeMm as number, thickness: a.thicknessMm as number | undefined }
  if (section === 'tube') return { outside: a.sizeMm as number, wall: a.wallMm as number | undefined }
  return { size: a.sizeMm as number }
}

export function workbenchLinks(p: PartDetailDto): WorkbenchLink[] {
  const a = p.attributes
  const pressure = p.pressureBearing ? 1 : undefined
  if (p.kind === 'fastener' && typeof a.thread === 'string') {
    return [{ label: `Tapping and clearance drills for ${a.thread}`, to: `/workbench?${qs({ thread: a.thread, pressure })}` }]
  }
  const section = String(a.section ?? '')
  if (p.kind === 'stock' && (SECTION_SHAPES as readonly string[]).includes(section)) {
    const material = findMaterial(String(a.material ?? ''))?.id ?? String(a.material ?? '')
    const base = { section, ...barSize(section, a), material, pressure }
    const pieces = p.lots.map((l) => l.quantity).filter((q) => q > 0)
    const links = [{ label: 'Weight and cost of this bar', to: `/workbench?${qs(base)}` }]
    if (pieces.length) links.push({ label: 'Plan cuts from the pieces in stock', to: `/workbench?${qs({ ...base, stock: pieces.join(',') })}` })
    return links
  }
  return []
}
