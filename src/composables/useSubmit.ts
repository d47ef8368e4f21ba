import { ref, type Ref } from 'vue'
import { message, type FormInstance } from 'ant-design-vue'
import { toApiError, type ApiError } from '../api/http'

export interface SubmitOptions {
  /** The a-form to validate before saving; when it fails the form shows why and nothing is sent. */
  form?: Ref<FormInstance | undefined>
  /** 'inline' keeps the message in `error` for the form's a-alert; 'message' pops it up instead. */
  show?: 'inline' | 'message'
  /** Takes the error instead of showing it, for forms that put it beside a field or ask again. */
  onError?: (err: ApiError) => void
}

/**
 * The saving flag and error message around a form's one API call, so that every form handles a
 * refusal the same way: `submit(fn)` resolves to fn's result, or undefined when it failed.
 */
export function useSubmit(options: SubmitOptions = {}) {
  const saving = ref(false)
  const error = ref('')
  async function submit<T>(action: () => Promise<T>): Promise<T | undefined> {
    error.value = ''
    if (options.form?.value) {
      try {
        await options.form.value.validate()
      } catch {
        return undefined
      }
    }
    saving.value = true
    try {
      return await action()
    } catch (e) {
      const err = toApiError(e)
      if (options.onError) options.onError(err)
      else if (options.show === 'message') message.error(err.message)
      else error.value = err.message
      return undefined
    } finally {
      saving.value = false
    }
  }
  return { saving, error, submit }
}
