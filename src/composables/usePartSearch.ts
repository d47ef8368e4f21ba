import { onScopeDispose, ref, watch } from 'vue'
import { useRoute, useRouter } from 'vue-router'
import { partsApi } from '../api/parts'
import { useAsync } from './useAsync'
import { PART_KINDS, type PartKind } from '../../shared/types/domain'
import { DEFAULT_PAGE_SIZE } from '../../shared/schemas/part-list'

/** Wait this long after the last key before searching: one request per pause in typing. */
export const SEARCH_DEBOUNCE_MS = 200

/**
 * The parts search, kept in the address (?q=&kind=&page=) so Back returns to the same list
 * and a search can be bookmarked. Typing is debounced; a kind or page change searches at once.
 */
export function usePartSearch() {
  const route = useRoute()
  const router = useRouter()
  const str = (v: unknown) => (typeof v === 'string' ? v : '')
  const q = ref(str(route.query.q))
  const kind = ref<PartKind | undefined>(PART_KINDS.find((k) => k === route.query.kind))
  const page = ref(Number(route.query.page) || 1)
  const pageSize = ref(Number(route.query.pageSize) || DEFAULT_PAGE_SIZE)
  /** Archived parts leave the list; a storekeeper shows them to restore one. */
  const includeArchived = ref(route.query.archived === '1')
  const result = useAsync(() => partsApi.list({
    q: q.value, kind: kind.value, page: page.value, pageSize: pageSize.value, includeArchived: includeArchived.value || undefined,
  }))

  function search() {
    void router.replace({ query: {
      q: q.value || undefined, kind: kind.value, page: page.value > 1 ? page.value : undefined,
      pageSize: pageSize.value !== DEFAULT_PAGE_SIZE ? pageSize.value : undefined, archived: includeArchived.value ? '1' : undefined,
    } })
    return result.run()
  }

  let timer: ReturnType<typeof setTimeout> | undefined
  watch(q, () => {
    clearTimeout(timer)
    page.value = 1
    timer = setTimeout(search, SEARCH_DEBOUNCE_MS)
  })
  watch([kind, includeArchived], () => {
    page.value = 1
    void search()
  })
  onScopeDispose(() => clearTimeout(timer))

  function goTo(p: number, size = pageSize.value) {
    page.value = size === pageSize.value ? p : 1
    pageSize.value = size
    return search()
  }

  return { q, kind, page, pageSize, includeArchived, result, search, goTo }
}
