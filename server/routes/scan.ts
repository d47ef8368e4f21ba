import { Router } from 'express'
import { currentUser, requireSignIn } from '../middleware/auth'
import { resolveScan } from '../services/scan'
import { drawLinesForBin } from '../services/bin-draw-lines'
import { idParam } from '../../shared/schemas/user'
import { scanQuery } from '../../shared/schemas/labels'

/** /api/scan: what a scanned label or a typed code opens, and what the bin page offers (anyone signed in). */
export const scanRouter = Router()
scanRouter.use(requireSignIn)

scanRouter.get('/resolve', async (req, res) => {
  res.json(await resolveScan(scanQuery.parse(req.query).code))
})

/** Open build lines the signed-in user may draw from this bin (reserved lines first). */
scanRouter.get('/bins/:id/draw-lines', async (req, res) => {
  res.json(await drawLinesForBin(idParam.parse(req.params).id, currentUser(req)))
})
