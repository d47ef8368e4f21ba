import { ref, shallowRef, type Ref, type ShallowRef } from 'vue'
import { toApiError, type ApiError } from '../api/http'

export interface AsyncState<T, A extends unknown[]> {
  data: ShallowRef<T | undefined>
  error: Ref<ApiError | undefined>
  loading: Ref<boolean>
  /** Runs the loader; resolves to the data, or undefined after an error (kept in `error`). */
  run: (...args: A) => Promise<T | undefined>
}

/** Loading and error state around one API call; views show `loading` and `error` as they are. */
export function useAsync<T, A extends unknown[] = []>(load: (...args: A) => Promise<T>): AsyncState<T, A> {
  const data = shallowRef<T>()
  const error = ref<ApiError>()
  const loading = ref(false)
  let latest = 0
  async function run(...args: A) {
    const call = ++latest
    loading.value = true
    error.value = undefined
    try {
      const result = await load(...args)
      // A slower earlier call must not overwrite a newer answer (search-as-you-type).
      if (call === latest) data.value = result
      return result
    } catch (e) {
      if (call === latest) error.value = toApiError(e)
      return undefined
    } finally {
      if (call === latest) loading.value = false
    }
  }
  return { data, error, loading, run }
}
