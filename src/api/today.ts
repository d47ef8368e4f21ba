import { query, request } from './http'
import type { Page } from '../../shared/types/api'
import type { TodayDto, TodayList } from '../../shared/types/today'

export type { TodayDto, TodayList }

export const todayApi = {
  get: () => request<TodayDto>('GET', '/today'),
  list: <T>(list: TodayList, p: { page?: number; pageSize?: number } = {}) => request<Page<T>>('GET', `/today/${list}${query(p)}`),
}
