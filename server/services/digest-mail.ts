/** The alert digest e-mail as text and HTML: one line per new alert, each linking to its part. */
import type { Alert } from '../entities'
import type { SuggestionLineDto } from '../../shared/types/order'
import type { AlertKind } from '../../shared/types/domain'

export interface DigestLine {
  alert: Alert
  partCode: string
  partName: string
  unit: string
  /** For low-stock and shortage alerts: the live figures and the suggested order. */
  stock?: { onHand: number; reserved: number; available: number; reorderPoint: number }
  suggestion?: SuggestionLineDto
}

const HEADINGS: Record<AlertKind, string> = {
  'low-stock': 'At or below the reorder point',
  shortage: 'Short for builds',
  expired: 'Expired batches',
  expiring: 'Batches expiring soon',
}
const ORDER: AlertKind[] = ['low-stock', 'shortage', 'expired', 'expiring']

const n = (x: number) => String(Math.round(x * 1000) / 1000)
const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!)

/** The line after the part's code and name (alert messages name the part themselves; not twice). */
function detail(l: DigestLine): string {
  if (l.alert.kind === 'low-stock' && l.stock) {
    const s = l.stock
    return `${n(s.available)} ${l.unit} available (on hand ${n(s.onHand)}, reserved ${n(s.reserved)}), reorder point ${n(s.reorderPoint)}`
  }
  const part = `${l.partCode} ${l.partName}`
  return l.alert.message.replace(`${part}, `, '').replace(` of ${part}`, '')
}

function order(l: DigestLine): string {
  const s = l.suggestion
  return s ? `suggested order ${n(s.quantity)} ${l.unit} (${s.packs} × ${n(s.packSize)})` : ''
}

export function subjectOf(lines: DigestLine[]): string {
  const count = (k: AlertKind) => lines.filter((l) => l.alert.kind === k).length
  const bits = [
    count('low-stock') && `${count('low-stock')} low`, count('shortage') && `${count('shortage')} short for builds`,
    count('expired') && `${count('expired')} expired`, count('expiring') && `${count('expiring')} expiring`,
  ].filter(Boolean)
  return `Stores alert: ${bits.join(', ')}`
}

export function composeDigest(lines: DigestLine[], stillOpen: number, publicUrl: string) {
  const partUrl = (l: DigestLine) => `${publicUrl}/parts/${l.alert.partId}`
  const ordersUrl = `${publicUrl}/orders?suggest=1`
  const groups = ORDER.map((k) => ({ kind: k, lines: lines.filter((l) => l.alert.kind === k) })).filter((g) => g.lines.length)
  const text = [
    'These need attention in the stores:', '',
    ...groups.flatMap((g) => [
      `${HEADINGS[g.kind]}:`,
      ...g.lines.map((l) => `- ${l.partCode} ${l.partName}: ${detail(l)}${order(l) ? `; ${order(l)}` : ''}\n  ${partUrl(l)}`),
      '',
    ]),
    `Open the order suggestions: ${ordersUrl}`,
    stillOpen ? `\n${stillOpen} earlier alert(s) are still open; they were in an earlier e-mail.` : '',
  ].join('\n')
  const html = `<div style="font-family: 'Noto Sans', Arial, sans-serif; color: #1f2b31">
<p>These need attention in the stores:</p>
${groups.map((g) => `<h3 style="margin: 16px 0 4px">${esc(HEADINGS[g.kind])}</h3><ul>
${g.lines.map((l) => `<li><a href="${esc(partUrl(l))}">${esc(l.partCode)} ${esc(l.partName)}</a>: ${esc(detail(l))}${order(l) ? `; <strong>${esc(order(l))}</strong>` : ''}</li>`).join('\n')}
</ul>`).join('\n')}
<p><a href="${esc(ordersUrl)}" style="display: inline-block; background: #7a5312; color: #ffffff; padding: 8px 14px; border-radius: 4px; text-decoration: none">Open the order suggestions</a></p>
${stillOpen ? `<p style="color: #5a646a">${stillOpen} earlier alert(s) are still open; they were in an earlier e-mail.</p>` : ''}
</div>`
  return { subject: subjectOf(lines), text, html }
}
