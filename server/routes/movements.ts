import { Router } from 'express'
import { currentUser, requireRole, requireSignIn } from '../middleware/auth'
import { exportMovementsCsv, ledgerPeople, listMovements } from '../services/movements'
import { reverseStockMovement } from '../services/stock'
import { idParam } from '../../shared/schemas/user'

/** The ledger: filtered pages, CSV export, and reversing a mistaken movement. */
export const movementsRouter = Router()

movementsRouter.get('/', requireSignIn, async (req, res) => {
  res.json(await listMovements(req.query as never))
})

movementsRouter.get('/export.csv', requireSignIn, async (req, res) => {
  const csv = await exportMovementsCsv(req.query as never)
  res.type('text/csv; charset=utf-8')
  res.attachment(`binwright-ledger-${new Date().toISOString().slice(0, 10)}.csv`)
  res.send(csv)
})

movementsRouter.get('/people', requireSignIn, async (_req, res) => {
  res.json(await ledgerPeople())
})

movementsRouter.post('/:id/reverse', requireRole('storekeeper'), async (req, res) => {
  res.json(await reverseStockMovement(idParam.parse(req.params).id, req.body, currentUser(req)))
})
