import { request } from './http'
import type { SessionDto, UserDto } from '../../shared/types/api'
import type { ChangePasswordInput, LoginInput } from '../../shared/schemas/user'

export const authApi = {
  session: () => request<SessionDto>('GET', '/auth/session'),
  login: (input: LoginInput) => request<{ user: UserDto; csrfToken: string }>('POST', '/auth/login', input),
  logout: () => request<void>('POST', '/auth/logout'),
  changePassword: (input: ChangePasswordInput) => request<void>('POST', '/auth/password', input),
}
