import { request } from './http'
import type { UserDto } from '../../shared/types/api'
import type { CreateUserInput, UpdateUserInput } from '../../shared/schemas/user'

export const usersApi = {
  list: () => request<UserDto[]>('GET', '/users'),
  create: (input: CreateUserInput) => request<UserDto>('POST', '/users', input),
  update: (id: number, input: UpdateUserInput) => request<UserDto>('PATCH', `/users/${id}`, input),
}
