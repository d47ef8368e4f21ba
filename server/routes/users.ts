import { Router } from 'express'
import { requireRole, currentUser } from '../middleware/auth'
import { createUser, listUsers, updateUser } from '../services/users'
import { createUserInput, idParam, updateUserInput } from '../../shared/schemas/user'

/** User administration: admins only. */
export const usersRouter = Router()
usersRouter.use(requireRole('admin'))

usersRouter.get('/', async (_req, res) => {
  res.json(await listUsers())
})

usersRouter.post('/', async (req, res) => {
  res.status(201).json(await createUser(createUserInput.parse(req.body)))
})

usersRouter.patch('/:id', async (req, res) => {
  const { id } = idParam.parse(req.params)
  res.json(await updateUser(id, updateUserInput.parse(req.body), currentUser(req).id))
})
