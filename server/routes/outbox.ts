import { Router } from 'express'
import { z } from 'zod'
import { requireRole } from '../middleware/auth'
import { listOutbox, outboxAttachment, outboxMessage, outboxStatus, retryMessage } from '../services/outbox'
import { idParam } from '../../shared/schemas/supplier'

const listQuery = z.object({
  status: z.enum(['queued', 'sent', 'failed']).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
})
const attachmentParams = z.object({ id: z.coerce.number().int().positive(), index: z.coerce.number().int().min(0) })

/** Every e-mail the app sent or tried to send: admins only (it holds addresses and orders). */
export const outboxRouter = Router()
outboxRouter.use(requireRole('admin'))

outboxRouter.get('/', async (req, res) => {
  const q = listQuery.parse(req.query)
  res.json(await listOutbox(q.status, q.page, q.pageSize))
})

outboxRouter.get('/status', async (_req, res) => {
  res.json(await outboxStatus())
})

outboxRouter.get('/:id', async (req, res) => {
  res.json(await outboxMessage(idParam.parse(req.params).id))
})

outboxRouter.get('/:id/attachments/:index', async (req, res) => {
  const p = attachmentParams.parse(req.params)
  const a = await outboxAttachment(p.id, p.index)
  res.type(a.contentType).attachment(a.filename).send(a.content)
})

outboxRouter.post('/:id/retry', async (req, res) => {
  res.json(await retryMessage(idParam.parse(req.params).id))
})
