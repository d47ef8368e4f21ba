import type { BinLineDto } from '../../../shared/types/stock'
import { stockModeOf, type StockMode } from '../../../shared/types/domain'
import { cautionsOf } from '../../../shared/domain/cautions'

export type BinAction = 'take' | 'return' | 'draw' | 'move'

export const modeOf = (line: Pick<BinLineDto, 'kind'>): StockMode => stockModeOf(line.kind)
export const lineCautions = (line: BinLineDto) => cautionsOf(line)

/** "120 pcs", "310 mm", "2 bottles" with float noise removed (bar lengths to 0.1 mm). */
export function amount(quantity: number, unit: string): string {
  const n = Math.round(quantity * 10) / 10
  if (unit === 'pcs') return n === 1 ? '1 pc' : `${n} pcs`
  return `${n} ${unit}${n !== 1 && !['mm', 'm', 'ml', 'l', 'g', 'kg'].includes(unit) && !unit.endsWith('s') ? 's' : ''}`
}

/** What kind of lot the line is: a bar piece, a batch, or the bin's count. */
export function lotLabel(line: BinLineDto): string {
  const mode = modeOf(line)
  if (mode === 'length') return 'Bar piece'
  if (mode === 'batch') return `Batch ${line.batchCode ?? '—'}${line.expiresOn ? ` · use by ${line.expiresOn}` : ''}`
  return ''
}
