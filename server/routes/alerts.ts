import { Router } from 'express'
import { requireRole, requireSignIn } from '../middleware/auth'
import { listAlerts, refreshAllAlerts, settle } from '../services/alerts'
import { sendDigest } from '../services/digest'
import { alertQuery } from '../../shared/schemas/alert'

/** Open (and past) alerts; the digest e-mail on demand. */
export const alertsRouter = Router()

alertsRouter.get('/', requireSignIn, async (req, res) => {
  res.json(await listAlerts(alertQuery.parse(req.query)))
})

/** E-mails the alerts no digest has listed yet; an alert that stays open is not sent again. */
alertsRouter.post('/digest', requireRole('storekeeper'), async (_req, res) => {
  res.json(await sendDigest())
})

/** Looks at every part again now (expiry dates, builds that changed status). */
alertsRouter.post('/refresh', requireRole('storekeeper'), async (_req, res) => {
  await refreshAllAlerts()
  await settle()
  res.status(204).end()
})
