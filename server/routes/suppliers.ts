import { Router } from 'express'
import { z } from 'zod'
import { requireRole } from '../middleware/auth'
import {
  addOffer, createSupplier, deleteSupplier, getSupplier, listSuppliers, removeOffer, updateOffer, updateSupplier,
} from '../services/suppliers'
import { idParam, listQuery } from '../../shared/schemas/supplier'

const offerParams = z.object({ id: z.coerce.number().int().positive(), offerId: z.coerce.number().int().positive() })

/** Suppliers and their offers: storekeepers and admins keep them. */
export const suppliersRouter = Router()
suppliersRouter.use(requireRole('storekeeper'))

suppliersRouter.get('/', async (req, res) => {
  const q = listQuery.parse(req.query)
  res.json(await listSuppliers(q.q, q.page, q.pageSize))
})

suppliersRouter.get('/:id', async (req, res) => {
  res.json(await getSupplier(idParam.parse(req.params).id))
})

suppliersRouter.post('/', async (req, res) => {
  res.status(201).json(await createSupplier(req.body))
})

suppliersRouter.patch('/:id', async (req, res) => {
  res.json(await updateSupplier(idParam.parse(req.params).id, req.body))
})

suppliersRouter.delete('/:id', async (req, res) => {
  await deleteSupplier(idParam.parse(req.params).id)
  res.status(204).end()
})

suppliersRouter.post('/:id/offers', async (req, res) => {
  res.status(201).json(await addOffer(idParam.parse(req.params).id, req.body))
})

suppliersRouter.patch('/:id/offers/:offerId', async (req, res) => {
  const p = offerParams.parse(req.params)
  res.json(await updateOffer(p.id, p.offerId, req.body))
})

suppliersRouter.delete('/:id/offers/:offerId', async (req, res) => {
  const p = offerParams.parse(req.params)
  await removeOffer(p.id, p.offerId)
  res.status(204).end()
})
