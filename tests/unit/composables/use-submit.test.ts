import { describe, expect, it, vi } from 'vitest'
import { ref } from 'vue'
import type { FormInstance } from 'ant-design-vue'
import { useSubmit } from '../../../src/composables/useSubmit'
import { ApiError } from '../../../src/api/http'

describe('useSubmit', () => {
  it('resolves to the call\'s result and is saving only while the call runs', async () => {
    const { saving, error, submit } = useSubmit()
    let during = false
    const result = await submit(async () => { during = saving.value; return 42 })
    expect(result).toBe(42)
    expect(during).toBe(true)
    expect(saving.value).toBe(false)
    expect(error.value).toBe('')
  })

  it('keeps the server\'s message when the call is refused, and clears it on the next try', async () => {
    const { saving, error, submit } = useSubmit()
    const refused = await submit(() => Promise.reject(new ApiError(409, 'INSUFFICIENT_STOCK', 'Only 3 pcs in A1-03.')))
    expect(refused).toBeUndefined()
    expect(error.value).toBe('Only 3 pcs in A1-03.')
    expect(saving.value).toBe(false)
    await submit(async () => undefined)
    expect(error.value).toBe('')
  })

  it('hands the ApiError to onError instead of showing it', async () => {
    const onError = vi.fn()
    const { error, submit } = useSubmit({ onError })
    await submit(() => Promise.reject(new ApiError(409, 'OVER_RECEIPT', 'More than was ordered.')))
    expect(onError).toHaveBeenCalledWith(expect.objectContaining({ code: 'OVER_RECEIPT', status: 409 }))
    expect(error.value).toBe('')
  })

  it('sends nothing when the form fails its validation', async () => {
    const form = ref({ validate: () => Promise.reject(new Error('name: required')) } as unknown as FormInstance)
    const action = vi.fn(async () => 1)
    const { saving, error, submit } = useSubmit({ form })
    expect(await submit(action)).toBeUndefined()
    expect(action).not.toHaveBeenCalled()
    expect(saving.value).toBe(false)
    expect(error.value).toBe('')
  })
})
