import { z } from 'zod'
import {
  DEFAULT_SHEET_ID, PAPER_IDS, SHEET_PRESETS, customSheet, findSheet, labelsPerSheet, sheetProblems,
  type SheetLayout,
} from '../domain/label-sheets'
import { DEFAULT_LABEL_FIELDS } from '../domain/label-layout'

/** Most labels one request may lay out: 40 A4 sheets of 24, far beyond one printing session. */
export const MAX_LABELS = 1000
/** Copies of each label (one for the drawer front, one inside …). */
export const MAX_COPIES = 10

const id = z.number().int().positive()

/** Which bins or parts to label: by id, by typed code list, and/or a whole rack (bins only). */
export const labelSelection = z.object({
  kind: z.enum(['bin', 'part']),
  ids: z.array(id).max(MAX_LABELS).default([]),
  /** Bin codes (A1-03) or label codes, or part codes, as pasted from a list. */
  codes: z.array(z.string().trim().min(1).max(48)).max(MAX_LABELS).default([]),
  rackId: id.optional(),
}).strict().refine((s) => s.ids.length || s.codes.length || s.rackId, {
  message: 'choose at least one bin or part', path: ['ids'],
})
export type LabelSelection = z.input<typeof labelSelection>

const mm = (min: number, max: number) => z.number().min(min, `must be at least ${min} mm`).max(max, `must be at most ${max} mm`)

/** A custom grid in mm; it must fit its paper. */
export const sheetGrid = z.object({
  paper: z.enum(PAPER_IDS as [string, ...string[]]).transform((p) => p as SheetLayout['paper']),
  columns: z.number().int().min(1).max(20),
  rows: z.number().int().min(1).max(50),
  /** 10 mm is about the smallest label a QR code and a code can share. */
  labelWidthMm: mm(10, 280),
  labelHeightMm: mm(5, 280),
  marginTopMm: mm(0, 150),
  marginLeftMm: mm(0, 150),
  gapXMm: mm(0, 50),
  gapYMm: mm(0, 50),
}).strict().superRefine((g, ctx) => {
  for (const message of sheetProblems(g)) ctx.addIssue({ code: 'custom', message, path: ['columns'] })
})
export type SheetGridInput = z.input<typeof sheetGrid>

export const labelFields = z.object({
  qr: z.boolean(), code: z.boolean(), name: z.boolean(), size: z.boolean(), caution: z.boolean(),
}).strict().refine((f) => Object.values(f).some(Boolean), { message: 'choose at least one thing to print' })

/** POST /api/labels/pdf: what to label, on which sheet, from which position, printing what. */
export const labelPdfInput = z.object({
  selection: labelSelection,
  /** A preset id, or "custom" with `custom` given. */
  sheetId: z.string().default(DEFAULT_SHEET_ID),
  custom: sheetGrid.optional(),
  /** First free position on the first sheet (1-based, across then down). */
  startPosition: z.number().int().min(1).default(1),
  copies: z.number().int().min(1).max(MAX_COPIES).default(1),
  fields: labelFields.default(DEFAULT_LABEL_FIELDS),
}).strict().superRefine((input, ctx) => {
  const sheet = sheetOf(input)
  if (!sheet) {
    ctx.addIssue({ code: 'custom', path: ['sheetId'], message: input.sheetId === 'custom' ? 'give the custom grid' : `no sheet ${input.sheetId}; choose one of ${SHEET_PRESETS.map((s) => s.id).join(', ')}` })
  } else if (input.startPosition > labelsPerSheet(sheet)) {
    ctx.addIssue({ code: 'custom', path: ['startPosition'], message: `the sheet has ${labelsPerSheet(sheet)} positions` })
  }
})
export type LabelPdfInput = z.input<typeof labelPdfInput>

/** The sheet a request names: a preset, or its custom grid. */
export function sheetOf(input: { sheetId: string; custom?: z.infer<typeof sheetGrid> }): SheetLayout | undefined {
  if (input.sheetId === 'custom') return input.custom ? customSheet(input.custom) : undefined
  return findSheet(input.sheetId)
}

/** GET /api/scan/resolve?code=: whatever a scanner or a person typed (a code or a whole URL). */
export const scanQuery = z.object({ code: z.string().trim().min(1, 'type or scan a code').max(300) })
