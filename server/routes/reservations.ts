import { Router } from 'express'
import { requireSignIn } from '../middleware/auth'
import { listReservations } from '../services/builds-reservations-list'
import { reservationsQuery } from '../../shared/schemas/build'

/** GET /api/reservations?partId=: which builds hold a part. Changes go through /api/builds. */
export const reservationsRouter = Router()
reservationsRouter.use(requireSignIn)

reservationsRouter.get('/', async (req, res) => {
  const q = reservationsQuery.parse(req.query)
  res.json(await listReservations(q.partId, q.page, q.pageSize))
})
