import { Router } from 'express'
import { requireRole, requireSignIn } from '../middleware/auth'
import {
  binContents, createBin, createRack, createWorkshop, placeTree, renameWorkshop, setBinRetired, updateBin, updateRack,
} from '../services/places'
import { idParam } from '../../shared/schemas/user'

/** Bins: the place tree, a bin's contents by code, and the storekeeper's bin upkeep. */
export const binsRouter = Router()
binsRouter.use(requireSignIn)

binsRouter.get('/', async (_req, res) => {
  res.json(await placeTree())
})

/** A human code (A3-07) or the label code a QR carries. */
binsRouter.get('/:code', async (req, res) => {
  res.json(await binContents(String(req.params.code)))
})

binsRouter.post('/', requireRole('storekeeper'), async (req, res) => {
  res.status(201).json(await createBin(req.body))
})

binsRouter.patch('/:id', requireRole('storekeeper'), async (req, res) => {
  res.json(await updateBin(idParam.parse(req.params).id, req.body))
})

binsRouter.post('/:id/retire', requireRole('storekeeper'), async (req, res) => {
  res.json(await setBinRetired(idParam.parse(req.params).id, true))
})

binsRouter.post('/:id/unretire', requireRole('storekeeper'), async (req, res) => {
  res.json(await setBinRetired(idParam.parse(req.params).id, false))
})

/** Racks: created and renamed by storekeepers; listed through GET /api/bins. */
export const racksRouter = Router()
racksRouter.use(requireRole('storekeeper'))

racksRouter.post('/', async (req, res) => {
  res.status(201).json(await createRack(req.body))
})

racksRouter.patch('/:id', async (req, res) => {
  res.json(await updateRack(idParam.parse(req.params).id, req.body))
})

/** Workshops: the top of the place tree. */
export const workshopsRouter = Router()
workshopsRouter.use(requireRole('storekeeper'))

workshopsRouter.post('/', async (req, res) => {
  res.status(201).json(await createWorkshop(req.body))
})

workshopsRouter.patch('/:id', async (req, res) => {
  res.json(await renameWorkshop(idParam.parse(req.params).id, req.body))
})
