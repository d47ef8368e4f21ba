import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { authApi } from '../api/auth'
import { takeEarlySession } from '../api/early'
import { setCsrfToken } from '../api/http'
import { roleAtLeast, type Role, type UserDto } from '../../shared/types/api'
import type { LoginInput } from '../../shared/schemas/user'

/** The signed-in user, shared by the shell, the router guard and every view. */
export const useSessionStore = defineStore('session', () => {
  const user = ref<UserDto | null>(null)
  /** True once the server has told us who (if anyone) is signed in. */
  const loaded = ref(false)

  async function load() {
    // The first load uses the read index.html started with the page; a failed one is asked again.
    const s = await (takeEarlySession()?.catch(() => authApi.session()) ?? authApi.session())
    setCsrfToken(s.csrfToken)
    user.value = s.user
    loaded.value = true
  }

  async function signIn(input: LoginInput) {
    const res = await authApi.login(input)
    setCsrfToken(res.csrfToken)
    user.value = res.user
  }

  async function signOut() {
    await authApi.logout().catch(() => undefined)
    user.value = null
    await load()
  }

  /** Whether the user's role is `role` or above (viewer < builder < storekeeper < admin). */
  const can = (role: Role) => !!user.value && roleAtLeast(user.value.role, role)
  const signedIn = computed(() => !!user.value)

  return { user, loaded, signedIn, load, signIn, signOut, can }
})
