import { Router } from 'express'
import { requireRole, requireSignIn } from '../middleware/auth'
import { partSupply, reorderSuggestion, setReorderRules } from '../services/supply'
import { idParam } from '../../shared/schemas/supplier'

/**
 * A part's supply side, mounted beside the parts router under /api/parts:
 * GET /:id/supply, GET /:id/reorder-suggestion, PATCH /:id/reorder.
 */
export const reorderRouter = Router()

reorderRouter.get('/:id/supply', requireSignIn, async (req, res) => {
  res.json(await partSupply(idParam.parse(req.params).id))
})

reorderRouter.get('/:id/reorder-suggestion', requireSignIn, async (req, res) => {
  res.json(await reorderSuggestion(idParam.parse(req.params).id, req.query))
})

reorderRouter.patch('/:id/reorder', requireRole('storekeeper'), async (req, res) => {
  res.json(await setReorderRules(idParam.parse(req.params).id, req.body))
})
