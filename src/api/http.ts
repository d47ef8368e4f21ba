import type { ApiErrorBody } from '../../shared/types/api'

/** An API error as the client sees it: the server's code and message, plus the HTTP status. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message)
  }
}

let csrfToken = ''
/** The session's CSRF token; set from /api/auth/session and after sign-in. */
export const setCsrfToken = (token: string) => {
  csrfToken = token
}

/** Called when the server answers 401, so the app can send the user to sign in. */
let onUnauthorised: (() => void) | undefined
export const setUnauthorisedHandler = (handler: () => void) => {
  onUnauthorised = handler
}

/** The one fetch wrapper: JSON in and out, errors turned into ApiError. `path` is under /api. */
export async function request<T>(method: string, path: string, body?: unknown): Promise<T> {
  // FormData (uploads) and Blob (a CSV file as text/csv) go as they are; anything else as JSON.
  const isForm = (typeof FormData !== 'undefined' && body instanceof FormData) || (typeof Blob !== 'undefined' && body instanceof Blob)
  const headers: Record<string, string> = { accept: 'application/json' }
  if (method !== 'GET') headers['x-csrf-token'] = csrfToken
  if (body !== undefined && !isForm) headers['content-type'] = 'application/json'
  const res = await fetch(`/api${path}`, {
    method,
    headers,
    credentials: 'same-origin',
    body: body === undefined ? undefined : isForm ? (body as BodyInit) : JSON.stringify(body),
  })
  if (res.status === 204) return undefined as T
  const data = await res.json().catch(() => undefined)
  if (!res.ok) {
    if (res.status === 401 && onUnauthorised) onUnauthorised()
    const err = (data as ApiErrorBody | undefined)?.error
    throw new ApiError(res.status, err?.code ?? 'HTTP_' + res.status, err?.message ?? res.statusText, err?.details)
  }
  return data as T
}

/** Builds a query string from defined, non-empty values. */
export function query(params: Record<string, string | number | boolean | undefined | null>): string {
  const q = new URLSearchParams()
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== null && v !== '') q.set(k, String(v))
  const s = q.toString()
  return s ? `?${s}` : ''
}

export const toApiError = (e: unknown): ApiError =>
  e instanceof ApiError ? e : new ApiError(0, 'NETWORK', e instanceof Error ? e.message : 'The server could not be reached.')

/** Like request, but answers with the body as a Blob (a PDF to download); errors as ApiError. */
export async function requestBlob(method: string, path: string, body?: unknown): Promise<Blob> {
  const headers: Record<string, string> = { accept: 'application/pdf, application/json' }
  if (method !== 'GET') headers['x-csrf-token'] = csrfToken
  if (body !== undefined) headers['content-type'] = 'application/json'
  const res = await fetch(`/api${path}`, {
    method, headers, credentials: 'same-origin', body: body === undefined ? undefined : JSON.stringify(body),
  })
  if (!res.ok) {
    if (res.status === 401 && onUnauthorised) onUnauthorised()
    const err = ((await res.json().catch(() => undefined)) as ApiErrorBody | undefined)?.error
    throw new ApiError(res.status, err?.code ?? 'HTTP_' + res.status, err?.message ?? res.statusText, err?.details)
  }
  return res.blob()
}
