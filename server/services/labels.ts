import { badRequest } from '../errors'
import { labelItems } from './label-items'
import { renderLabelPdf } from './label-pdf'
import { labelPdfInput, MAX_LABELS, sheetOf, type LabelPdfInput } from '../../shared/schemas/labels'
import { labelBoxes } from '../../shared/domain/label-layout'
import { pageCount } from '../../shared/domain/label-sheets'

export interface LabelPdf {
  pdf: Buffer
  labels: number
  pages: number
}

/**
 * POST /api/labels/pdf: the chosen labels laid out on a sheet. Refuses (400) a list with codes
 * that match nothing, more labels than one request may hold, and QR codes too small to scan.
 */
export async function labelPdf(raw: LabelPdfInput, publicUrl: string): Promise<LabelPdf> {
  const input = labelPdfInput.parse(raw)
  const sheet = sheetOf(input)!
  const { items, unknownCodes } = await labelItems(input.selection, publicUrl)
  if (unknownCodes.length) {
    throw badRequest('UNKNOWN_CODES', `No bin or part has the code${unknownCodes.length > 1 ? 's' : ''} ${unknownCodes.join(', ')}.`, { unknownCodes })
  }
  const labels = items.flatMap((item) => Array.from({ length: input.copies }, () => item))
  if (!labels.length) throw badRequest('NOTHING_TO_PRINT', 'The selection has no bins or parts to label.')
  if (labels.length > MAX_LABELS) {
    throw badRequest('TOO_MANY_LABELS', `That is ${labels.length} labels; print at most ${MAX_LABELS} at a time.`)
  }
  if (input.fields.qr) {
    const longest = labels.reduce((a, b) => (b.url.length > a.url.length ? b : a))
    const fit = labelBoxes(sheet.labelWidthMm, sheet.labelHeightMm, { ...longest, caution: null }, input.fields).qr!.fit
    if (!fit.scannable) throw badRequest('QR_TOO_SMALL', fit.problem!, { moduleMm: fit.moduleMm })
  }
  const pdf = await renderLabelPdf(labels, { sheet, startPosition: input.startPosition, fields: input.fields })
  return { pdf, labels: labels.length, pages: pageCount(sheet, labels.length, input.startPosition) }
}
