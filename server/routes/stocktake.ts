import { Router } from 'express'
import { currentUser, requireRole } from '../middleware/auth'
import { applyStockTake } from '../services/stocktake'

/** /api/stocktake: apply a multi-bin count in one go (storekeepers and up). */
export const stockTakeRouter = Router()
stockTakeRouter.use(requireRole('storekeeper'))

stockTakeRouter.post('/apply', async (req, res) => {
  res.json(await applyStockTake(req.body, currentUser(req).id))
})
