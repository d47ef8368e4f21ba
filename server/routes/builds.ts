import { Router } from 'express'
import { currentUser, requireRole, requireSignIn } from '../middleware/auth'
import { changeStatus, createBuild, getBuild, listBuilds, releasePreview, updateBuild } from '../services/builds'
import { addLine, copyLines, deleteLine, updateLine } from '../services/builds-lines'
import { importLines } from '../services/builds-import'
import { release, reserve } from '../services/builds-reserve'
import { drawForBuild, returnFromBuild } from '../services/builds-draw'
import { cuttingPlanFor } from '../services/builds-cutting'
import { listShortages } from '../services/shortages'
import { buildListQuery, lineParams, shortagesQuery } from '../../shared/schemas/build'
import { idParam } from '../../shared/schemas/user'

/** Builds, their BOM lines, reservations, draws and returns. Everyone signed in reads; builders and up change. */
export const buildsRouter = Router()
buildsRouter.use(requireSignIn)
const changes = requireRole('builder')
const id = (req: { params: unknown }) => idParam.parse(req.params).id

buildsRouter.get('/', async (req, res) => {
  res.json(await listBuilds(buildListQuery.parse(req.query), currentUser(req)))
})
buildsRouter.post('/', changes, async (req, res) => {
  res.status(201).json(await createBuild(req.body, currentUser(req)))
})
buildsRouter.get('/:id', async (req, res) => {
  res.json(await getBuild(id(req), currentUser(req)))
})
buildsRouter.patch('/:id', changes, async (req, res) => {
  res.json(await updateBuild(id(req), req.body, currentUser(req)))
})
buildsRouter.get('/:id/release-preview', async (req, res) => {
  res.json(await releasePreview(id(req)))
})
buildsRouter.post('/:id/status', changes, async (req, res) => {
  res.json(await changeStatus(id(req), req.body, currentUser(req)))
})
buildsRouter.get('/:id/shortages', async (req, res) => {
  const q = shortagesQuery.parse(req.query)
  res.json(await listShortages(q.page, q.pageSize, id(req)))
})

buildsRouter.post('/:id/lines', changes, async (req, res) => {
  res.status(201).json(await addLine(id(req), req.body, currentUser(req)))
})
buildsRouter.post('/:id/lines/import', changes, async (req, res) => {
  res.json(await importLines(id(req), req.body, currentUser(req)))
})
buildsRouter.post('/:id/lines/copy', changes, async (req, res) => {
  res.json(await copyLines(id(req), req.body, currentUser(req)))
})
buildsRouter.patch('/:id/lines/:lineId', changes, async (req, res) => {
  const p = lineParams.parse(req.params)
  res.json(await updateLine(p.id, p.lineId, req.body, currentUser(req)))
})
buildsRouter.delete('/:id/lines/:lineId', changes, async (req, res) => {
  const p = lineParams.parse(req.params)
  res.json(await deleteLine(p.id, p.lineId, currentUser(req)))
})
buildsRouter.get('/:id/lines/:lineId/cutting-plan', async (req, res) => {
  const p = lineParams.parse(req.params)
  res.json(await cuttingPlanFor(p.id, p.lineId))
})

buildsRouter.post('/:id/reserve', changes, async (req, res) => {
  res.json(await reserve(id(req), req.body, currentUser(req)))
})
buildsRouter.post('/:id/release', changes, async (req, res) => {
  res.json(await release(id(req), req.body, currentUser(req)))
})
buildsRouter.post('/:id/draw', changes, async (req, res) => {
  res.json(await drawForBuild(id(req), req.body, currentUser(req)))
})
buildsRouter.post('/:id/return', changes, async (req, res) => {
  res.json(await returnFromBuild(id(req), req.body, currentUser(req)))
})

/** GET /api/shortages: what open builds are short of, across all of them. */
export const shortagesRouter = Router()
shortagesRouter.use(requireSignIn)
shortagesRouter.get('/', async (req, res) => {
  const q = shortagesQuery.parse(req.query)
  res.json(await listShortages(q.page, q.pageSize))
})
