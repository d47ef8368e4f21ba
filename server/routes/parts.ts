import express, { Router } from 'express'
import { z } from 'zod'
import { currentUser, requireRole, requireSignIn } from '../middleware/auth'
import { searchParts } from '../services/part-search'
import {
  createPartRecord, deletePart, partByLabel, partDetail, setArchived, suggestCode, updatePartRecord,
} from '../services/part-records'
import { exportPartsCsv, importPartsCsv } from '../services/parts-csv'
import { exportStockLevelsCsv, importStockLevelsCsv } from '../services/stock-levels-csv'
import type { PartListQuery } from '../../shared/schemas/part-list'

/** A whole catalogue as CSV can pass the app's 1 MB JSON limit: 50,000 rows is about 5 MB. */
const CSV_LIMIT = '20mb'
const idParam = z.object({ id: z.coerce.number().int().positive() })
const id = (req: express.Request) => idParam.parse(req.params).id
/** A CSV import: raw text/csv with ?dryRun=false to apply, or JSON { csv, dryRun }. */
const csvBody = (req: express.Request) =>
  typeof req.body === 'string' ? { csv: req.body, dryRun: req.query.dryRun !== 'false' } : req.body

/** /api/parts: the catalogue. Reading needs a sign-in; changes need a storekeeper. */
export const partsRouter = Router()

partsRouter.get('/', requireSignIn, async (req, res) => {
  res.json(await searchParts(req.query as PartListQuery))
})

partsRouter.get('/export.csv', requireSignIn, async (req, res) => {
  res.type('text/csv').attachment('parts.csv').send(await exportPartsCsv(req.query.includeArchived === 'true'))
})

partsRouter.post('/import', requireRole('storekeeper'), express.text({ type: ['text/csv', 'text/plain'], limit: CSV_LIMIT }), async (req, res) => {
  res.json(await importPartsCsv(csvBody(req)))
})

partsRouter.post('/suggest-code', requireRole('storekeeper'), async (req, res) => {
  res.json(await suggestCode(req.body))
})

partsRouter.get('/by-label/:labelCode', requireSignIn, async (req, res) => {
  res.json(await partByLabel(String(req.params.labelCode)))
})

partsRouter.get('/:id', requireSignIn, async (req, res) => {
  res.json(await partDetail(id(req)))
})

partsRouter.post('/', requireRole('storekeeper'), async (req, res) => {
  res.status(201).json(await createPartRecord(req.body))
})

partsRouter.patch('/:id', requireRole('storekeeper'), async (req, res) => {
  res.json(await updatePartRecord(id(req), req.body))
})

partsRouter.post('/:id/archive', requireRole('storekeeper'), async (req, res) => {
  res.json(await setArchived(id(req), true))
})

partsRouter.post('/:id/restore', requireRole('storekeeper'), async (req, res) => {
  res.json(await setArchived(id(req), false))
})

partsRouter.delete('/:id', requireRole('storekeeper'), async (req, res) => {
  await deletePart(id(req))
  res.status(204).end()
})

/** /api/stock-levels: what every bin holds, as CSV out and in (a stock-take from a spreadsheet). */
export const stockLevelsRouter = Router()

stockLevelsRouter.get('/export.csv', requireSignIn, async (_req, res) => {
  res.type('text/csv').attachment('stock-levels.csv').send(await exportStockLevelsCsv())
})

stockLevelsRouter.post('/import', requireRole('storekeeper'), express.text({ type: ['text/csv', 'text/plain'], limit: CSV_LIMIT }), async (req, res) => {
  res.json(await importStockLevelsCsv(csvBody(req), currentUser(req).id))
})
