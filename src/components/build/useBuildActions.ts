import { h, ref, type Ref } from 'vue'
import { Modal, message } from 'ant-design-vue'
import { buildsApi, type BuildDetailDto } from '../../api/builds'
import { ApiError, toApiError } from '../../api/http'
import { formatQuantity } from './format'
import type { BuildLineDto } from '../../../shared/types/build'

interface Shortfall {
  lineId: number
  partCode: string
  requested: number
  available: number
  shortfall: number
}

/**
 * Reserve, release and remove for the build screen. A reservation the stores cannot cover is
 * refused whole; the user is then offered to reserve what there is and record the shortage.
 */
export function useBuildActions(build: Ref<BuildDetailDto | undefined>) {
  const busy = ref(false)
  const id = () => build.value!.id
  const unitOf = (lineId: number) => build.value?.lines.find((l) => l.id === lineId)?.unit ?? ''

  async function guarded(work: () => Promise<void>) {
    busy.value = true
    try {
      await work()
    } catch (e) {
      message.error(toApiError(e).message)
    } finally {
      busy.value = false
    }
  }

  function offerPartial(err: ApiError, line?: BuildLineDto) {
    const lines = ((err.details as { lines?: Shortfall[] })?.lines ?? [])
    Modal.confirm({
      title: 'Not enough free stock',
      content: h('div', [
        h('p', 'Nothing was reserved. Short:'),
        h('ul', lines.map((s) => h('li', `${s.partCode}: needs ${formatQuantity(s.requested, unitOf(s.lineId))}, `
          + `${formatQuantity(s.available, unitOf(s.lineId))} free — ${formatQuantity(s.shortfall, unitOf(s.lineId))} short`))),
        h('p', 'Reserve what there is and record the rest as a shortage for ordering?'),
      ]),
      okText: 'Reserve what there is',
      cancelText: 'Leave it',
      onOk: () => guarded(async () => {
        const r = await buildsApi.reserve(id(), { lineId: line?.id, allowPartial: true })
        build.value = r.build
        message.warning(`Reserved what there is; ${r.lines.filter((l) => l.shortQuantity > 0).length} line(s) recorded short.`)
      }),
    })
  }

  const reserve = (line?: BuildLineDto) => guarded(async () => {
    try {
      const r = await buildsApi.reserve(id(), { lineId: line?.id })
      build.value = r.build
      message.success(line ? `${line.partCode} reserved.` : 'Every line is reserved.')
    } catch (e) {
      const err = toApiError(e)
      if (err.status === 409 && err.code === 'INSUFFICIENT_STOCK') offerPartial(err, line)
      else throw err
    }
  })

  const release = (line?: BuildLineDto) => guarded(async () => {
    build.value = await buildsApi.release(id(), line?.id)
    message.success(line ? `${line.partCode} released.` : 'All reservations released.')
  })

  const remove = (line: BuildLineDto) => Modal.confirm({
    title: `Remove ${line.partCode} from the build?`,
    content: line.reserved > 0 ? `Its reservation of ${formatQuantity(line.reserved, line.unit)} is released.` : undefined,
    okText: 'Remove line',
    okButtonProps: { danger: true },
    onOk: () => guarded(async () => { build.value = await buildsApi.removeLine(id(), line.id) }),
  })

  return { busy, reserve, release, remove }
}
