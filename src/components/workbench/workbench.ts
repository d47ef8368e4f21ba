/** Small helpers the workbench panels share: remembered inputs, live results, query prefill. */
import { onScopeDispose, reactive, ref, watch } from 'vue'
import type { LocationQuery } from 'vue-router'
import type { ZodType } from 'zod'
import { useAsync } from '../../composables/useAsync'

const STORAGE_PREFIX = 'binwright.workbench.'
/** Wait this long after the last keystroke before asking the server (ms): one request per pause. */
const DEBOUNCE_MS = 300

const defined = <T extends object>(o: Partial<T>) =>
  Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined && v !== null && v !== '')) as Partial<T>

/** A form model remembered in localStorage between visits; values from the link (query) win. */
export function useRemembered<T extends object>(key: string, defaults: T, fromLink: Partial<T> = {}): T {
  const saved = readSaved<T>(key)
  const known = Object.fromEntries(Object.entries(saved).filter(([k]) => k in defaults)) as Partial<T>
  const model = reactive({ ...defaults, ...known, ...defined(fromLink) }) as T
  watch(model, (m) => {
    try {
      localStorage.setItem(STORAGE_PREFIX + key, JSON.stringify(m))
    } catch {
      // Private mode or a full store: the panel still works, it just forgets.
    }
  }, { deep: true })
  return model
}

function readSaved<T>(key: string): Partial<T> {
  try {
    return JSON.parse(localStorage.getItem(STORAGE_PREFIX + key) ?? '{}') as Partial<T>
  } catch {
    return {}
  }
}

/** Field path → first message, from the same schema the route uses. */
export type FieldErrors = Record<string, string>

/**
 * Checks the model with the route's schema as the user types and, once it is valid, asks the
 * server (after a short pause). Stale answers are dropped by useAsync.
 */
export function useLiveResult<M extends object, R>(schema: ZodType, model: M, load: (m: M) => Promise<R>) {
  const errors = ref<FieldErrors>({})
  const state = useAsync((m: M) => load(m))
  let timer: ReturnType<typeof setTimeout> | undefined
  const check = () => {
    const r = schema.safeParse(model)
    const found: FieldErrors = {}
    if (!r.success) for (const i of r.error.issues) found[i.path.join('.')] ??= i.message
    errors.value = found
    if (r.success) void state.run(defined(model) as M).then(() => {
      // A refused input must not leave the previous answer on screen as if it were this one's.
      if (state.error.value) state.data.value = undefined
    })
    else state.data.value = undefined
  }
  watch(() => JSON.stringify(model), () => {
    clearTimeout(timer)
    timer = setTimeout(check, DEBOUNCE_MS)
  })
  check()
  onScopeDispose(() => clearTimeout(timer))
  return { errors, ...state }
}

/** Props for an a-form-item showing a field's error under it. */
export const fieldState = (errors: FieldErrors, path: string) =>
  errors[path] ? { validateStatus: 'error' as const, help: errors[path] } : {}

/** A query value as text, or undefined. */
export function queryText(q: LocationQuery, key: string): string | undefined {
  const v = q[key]
  const s = Array.isArray(v) ? v[0] : v
  return s ? String(s) : undefined
}

/** A query value as a finite number, or undefined. */
export function queryNumber(q: LocationQuery, key: string): number | undefined {
  const s = queryText(q, key)
  const n = s === undefined ? NaN : Number(s)
  return Number.isFinite(n) ? n : undefined
}

/** Numbers for people: at most `places` decimals, grouped thousands. */
export const fmt = (x: number | undefined, places = 3) =>
  x === undefined ? '–' : x.toLocaleString(undefined, { maximumFractionDigits: places })

/** Shown beside anything that may be used for boilers and other pressure-bearing work. */
export const PRESSURE_CAUTION =
  'Pressure-bearing work (boilers, fittings, studs into a boiler): follow your local boiler code and a competent boiler inspector. These figures are workshop guidance, not a certificate.'
