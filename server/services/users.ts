import bcrypt from 'bcryptjs'
import { randomBytes } from 'node:crypto'
import { db } from '../db'
import { User } from '../entities'
import { AppError, conflict, notFound } from '../errors'
import type { UserDto } from '../../shared/types/api'
import type {
  ChangePasswordInput, CreateUserInput, UpdateUserInput,
} from '../../shared/schemas/user'

/** bcrypt work factor: 10 is bcrypt's long-standing default (≈ 70 ms a hash here). */
export const BCRYPT_ROUNDS = 10

const users = () => db().getRepository(User)

export const toUserDto = (u: User): UserDto => ({
  id: u.id,
  username: u.username,
  displayName: u.displayName,
  role: u.role,
  active: u.active,
  ...(u.email ? { email: u.email } : {}),
})

export const hashPassword = (plain: string) => bcrypt.hash(plain, BCRYPT_ROUNDS)

/** The active user with these credentials, or null (same answer for unknown name and bad password). */
export async function verifyCredentials(username: string, password: string): Promise<User | null> {
  const user = await users().findOneBy({ username: username.toLowerCase() })
  if (!user || !user.active) return null
  return (await bcrypt.compare(password, user.passwordHash)) ? user : null
}

/**
 * Signed-in users by id, so that a request does not read its user from the database each time.
 * Entries live USER_CACHE_MS at most and are dropped at once when the user is changed here
 * (deactivated, role or password changed), so a deactivated user is refused on the next request.
 * Keyed per DataSource: the benchmark and some tests run several databases in one process.
 */
const USER_CACHE_MS = 30_000
const userCache = new WeakMap<object, Map<number, { user: User | null; at: number }>>()

function cacheOf(): Map<number, { user: User | null; at: number }> {
  const ds = db()
  let m = userCache.get(ds)
  if (!m) userCache.set(ds, (m = new Map()))
  return m
}

/** Drops a user from the sign-in cache; call after any change to a user row. */
export const forgetUser = (id: number) => { cacheOf().delete(id) }

export async function findActiveUser(id: number): Promise<User | null> {
  const cache = cacheOf()
  const hit = cache.get(id)
  if (hit && Date.now() - hit.at < USER_CACHE_MS) return hit.user && Object.assign(new User(), hit.user)
  const user = await users().findOneBy({ id, active: true })
  cache.set(id, { user, at: Date.now() })
  return user && Object.assign(new User(), user)
}

export async function listUsers(): Promise<UserDto[]> {
  return (await users().find({ order: { username: 'ASC' } })).map(toUserDto)
}

export async function createUser(input: CreateUserInput): Promise<UserDto> {
  const username = input.username.toLowerCase()
  if (await users().existsBy({ username })) {
    throw conflict('USERNAME_TAKEN', `The username "${username}" is already in use.`)
  }
  const user = await users().save(users().create({
    username,
    displayName: input.displayName,
    role: input.role,
    email: input.email ?? null,
    passwordHash: await hashPassword(input.password),
    active: true,
  }))
  forgetUser(user.id)
  return toUserDto(user)
}

export async function updateUser(id: number, input: UpdateUserInput, actorId: number): Promise<UserDto> {
  const user = await users().findOneBy({ id })
  if (!user) throw notFound('The user')
  if (id === actorId && (input.active === false || (input.role && input.role !== 'admin'))) {
    throw conflict('OWN_ACCOUNT', 'You cannot deactivate yourself or remove your own admin role.')
  }
  const { password, ...rest } = input
  Object.assign(user, rest)
  if (password) user.passwordHash = await hashPassword(password)
  const saved = await users().save(user)
  forgetUser(id)
  return toUserDto(saved)
}

export async function changeOwnPassword(id: number, input: ChangePasswordInput): Promise<void> {
  const user = await users().findOneByOrFail({ id })
  if (!(await bcrypt.compare(input.currentPassword, user.passwordHash))) {
    throw new AppError(400, 'WRONG_PASSWORD', 'The current password is not right.')
  }
  user.passwordHash = await hashPassword(input.newPassword)
  await users().save(user)
  forgetUser(id)
}

/**
 * On an empty database, creates the first admin from ADMIN_USERNAME/ADMIN_PASSWORD, or with a
 * generated one-time password that is returned so the server can print it once.
 */
export async function ensureFirstAdmin(
  usernameIn: string, passwordIn?: string,
): Promise<{ username: string; oneTimePassword?: string } | null> {
  if ((await users().count()) > 0) return null
  const password = passwordIn ?? randomBytes(9).toString('base64url')
  const username = usernameIn.toLowerCase()
  await users().save(users().create({
    username, displayName: 'Administrator', role: 'admin', active: true, email: null,
    passwordHash: await hashPassword(password),
  }))
  return { username, ...(passwordIn ? {} : { oneTimePassword: password }) }
}
