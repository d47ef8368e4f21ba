import { Router } from 'express'
import { z } from 'zod'
import { requireSignIn } from '../middleware/auth'
import { today, todayList } from '../services/today'
import { TODAY_LISTS } from '../../shared/types/today'

const listParams = z.object({ list: z.enum(TODAY_LISTS) })
const pageQuery = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
})

/** What needs attention now: every signed-in role sees it. */
export const todayRouter = Router()
todayRouter.use(requireSignIn)

todayRouter.get('/', async (_req, res) => {
  res.json(await today())
})

todayRouter.get('/:list', async (req, res) => {
  const { list } = listParams.parse(req.params)
  const q = pageQuery.parse(req.query)
  res.json(await todayList(list, q.page, q.pageSize))
})
