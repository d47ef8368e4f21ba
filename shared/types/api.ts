/** The one error shape every API error uses. */
export interface ApiErrorBody {
  error: { code: string; message: string; details?: unknown }
}

/** A page of a list; every list route answers with this. */
export interface Page<T> {
  items: T[]
  total: number
  page: number
  pageSize: number
}

export const ROLES = ['viewer', 'builder', 'storekeeper', 'admin'] as const
export type Role = (typeof ROLES)[number]

/** Roles in increasing power: each role may do what the ones before it may. */
export const roleRank = (role: Role) => ROLES.indexOf(role)
export const roleAtLeast = (role: Role, needed: Role) => roleRank(role) >= roleRank(needed)

export interface UserDto {
  id: number
  username: string
  displayName: string
  role: Role
  active: boolean
}

export interface SessionDto {
  user: UserDto | null
  csrfToken: string
}
