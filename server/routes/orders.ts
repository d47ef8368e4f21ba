import { Router } from 'express'
import { currentUser, requireRole } from '../middleware/auth'
import { cancelOrder, closeOrder, createOrder, listOrders, orderDetail, updateDraft } from '../services/orders'
import { orderPdf, sendOrder } from '../services/order-send'
import { receiveOrder } from '../services/order-receive'
import { orderSuggestions } from '../services/order-suggestions'
import { orderListQuery } from '../../shared/schemas/order'
import { idParam } from '../../shared/schemas/supplier'

/** Purchase orders and the suggestions they start from: storekeepers and admins. */
export const ordersRouter = Router()
ordersRouter.use(requireRole('storekeeper'))

ordersRouter.get('/', async (req, res) => {
  res.json(await listOrders(orderListQuery.parse(req.query)))
})

ordersRouter.get('/suggestions', async (_req, res) => {
  res.json(await orderSuggestions())
})

ordersRouter.get('/:id', async (req, res) => {
  res.json(await orderDetail(idParam.parse(req.params).id))
})

ordersRouter.get('/:id/pdf', async (req, res) => {
  const { number, pdf } = await orderPdf(idParam.parse(req.params).id, currentUser(req).id)
  res.type('application/pdf').set('Content-Disposition', `inline; filename="${number}.pdf"`).send(pdf)
})

ordersRouter.post('/', async (req, res) => {
  res.status(201).json(await createOrder(req.body, currentUser(req).id))
})

ordersRouter.patch('/:id', async (req, res) => {
  res.json(await updateDraft(idParam.parse(req.params).id, req.body))
})

ordersRouter.post('/:id/send', async (req, res) => {
  res.json(await sendOrder(idParam.parse(req.params).id, currentUser(req).id))
})

ordersRouter.post('/:id/receive', async (req, res) => {
  res.json(await receiveOrder(idParam.parse(req.params).id, req.body, currentUser(req).id))
})

ordersRouter.post('/:id/cancel', async (req, res) => {
  res.json(await cancelOrder(idParam.parse(req.params).id))
})

ordersRouter.post('/:id/close', async (req, res) => {
  res.json(await closeOrder(idParam.parse(req.params).id))
})
