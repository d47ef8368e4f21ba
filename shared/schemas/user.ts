import { z } from 'zod'
import { ROLES } from '../types/api'

/** Password rule: at least 10 characters, not all one kind (common practice for short pass phrases). */
export const PASSWORD_MIN_LENGTH = 10
export const password = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `must be at least ${PASSWORD_MIN_LENGTH} characters`)
  .max(200, 'must be at most 200 characters')
  .refine((p) => /[A-Za-z]/.test(p) && /[^A-Za-z]/.test(p), 'must mix letters with digits or symbols')

export const username = z
  .string()
  .trim()
  .min(2, 'must be at least 2 characters')
  .max(64, 'must be at most 64 characters')
  .regex(/^[a-z0-9._-]+$/i, 'may use letters, digits, dot, dash and underscore only')

export const loginInput = z.object({
  username: z.string().trim().min(1, 'is required').max(64),
  password: z.string().min(1, 'is required').max(200),
})
export type LoginInput = z.infer<typeof loginInput>

export const createUserInput = z.object({
  username,
  displayName: z.string().trim().min(1, 'is required').max(120),
  role: z.enum(ROLES),
  password,
  email: z.email('must be an e-mail address').max(200).nullable().optional(),
}).strict()
export type CreateUserInput = z.infer<typeof createUserInput>

export const updateUserInput = z.object({
  displayName: z.string().trim().min(1).max(120).optional(),
  role: z.enum(ROLES).optional(),
  active: z.boolean().optional(),
  email: z.email('must be an e-mail address').max(200).nullable().optional(),
  password: password.optional(),
}).strict()
export type UpdateUserInput = z.infer<typeof updateUserInput>

export const changePasswordInput = z.object({
  currentPassword: z.string().min(1, 'is required').max(200),
  newPassword: password,
}).strict()
export type ChangePasswordInput = z.infer<typeof changePasswordInput>

export const idParam = z.object({ id: z.coerce.number().int().positive('must be a positive id') })
