import { onScopeDispose, ref } from 'vue'
import jsQR from 'jsqr'

/** Decode about eight frames a second: enough for a label held still, light on a phone's battery. */
const SCAN_INTERVAL_MS = 120
/** Frames are scaled down to this width before decoding: labels fill the view, so detail is ample. */
const DECODE_WIDTH = 640
/** The same code seen again within this time is the same label still in view, not a new scan. */
const REPEAT_MS = 2500

export type CameraState = 'off' | 'starting' | 'on' | 'error'

/** Torch is not in TypeScript's DOM types yet (it is in the Image Capture spec). */
type TorchCapabilities = MediaTrackCapabilities & { torch?: boolean }

/** Why the camera could not start, in words a workshop user can act on. */
export function cameraProblem(err: unknown): string {
  const name = (err as { name?: string })?.name
  if (name === 'NotAllowedError' || name === 'SecurityError') {
    return 'Camera access was refused. Allow the camera for this site in the browser\'s settings, or type the code below.'
  }
  if (name === 'NotFoundError' || name === 'OverconstrainedError' || name === 'DevicesNotFoundError') {
    return 'No camera was found on this device. Type the code below, or use a handheld scanner.'
  }
  if (name === 'NotReadableError') return 'The camera is in use by another app. Close it and try again, or type the code below.'
  return 'The camera could not be started. Type the code below, or use a handheld scanner.'
}

/**
 * The rear camera (where there is one) in a <video>, with frames decoded by jsQR on a canvas.
 * Browsers only offer the camera on HTTPS or localhost; elsewhere `problem` says so.
 */
export function useQrCamera(onCode: (text: string) => void) {
  const state = ref<CameraState>('off')
  const problem = ref('')
  const torchAvailable = ref(false)
  const torchOn = ref(false)
  let stream: MediaStream | undefined
  let video: HTMLVideoElement | undefined
  let timer: ReturnType<typeof setTimeout> | undefined
  let lastText = ''
  let lastAt = 0
  const canvas = document.createElement('canvas')
  const ctx = canvas.getContext('2d', { willReadFrequently: true })

  async function start(el: HTMLVideoElement) {
    video = el
    if (!window.isSecureContext || !navigator.mediaDevices?.getUserMedia) {
      state.value = 'error'
      problem.value = `The camera works only on HTTPS or localhost, and this page is at ${location.origin}. Type the code below, or use a handheld scanner.`
      return
    }
    state.value = 'starting'
    problem.value = ''
    try {
      stream = await navigator.mediaDevices.getUserMedia({ audio: false, video: { facingMode: { ideal: 'environment' }, width: { ideal: 1280 } } })
      el.srcObject = stream
      el.setAttribute('playsinline', 'true')
      await el.play()
      const track = stream.getVideoTracks()[0]
      torchAvailable.value = !!(track?.getCapabilities?.() as TorchCapabilities | undefined)?.torch
      state.value = 'on'
      tick()
    } catch (err) {
      stop()
      state.value = 'error'
      problem.value = cameraProblem(err)
    }
  }

  function tick() {
    timer = setTimeout(() => {
      if (state.value !== 'on') return
      const text = decodeFrame()
      if (text && (text !== lastText || Date.now() - lastAt > REPEAT_MS)) onCode(text)
      if (text) { lastText = text; lastAt = Date.now() }
      tick()
    }, SCAN_INTERVAL_MS)
  }

  function decodeFrame(): string | undefined {
    if (!video || !ctx || video.readyState < video.HAVE_CURRENT_DATA || !video.videoWidth) return undefined
    const scale = Math.min(1, DECODE_WIDTH / video.videoWidth)
    canvas.width = Math.round(video.videoWidth * scale)
    canvas.height = Math.round(video.videoHeight * scale)
    ctx.drawImage(video, 0, 0, canvas.width, canvas.height)
    const image = ctx.getImageData(0, 0, canvas.width, canvas.height)
    // Printed labels are dark on light; skipping the inverted pass halves the work per frame.
    return jsQR(image.data, image.width, image.height, { inversionAttempts: 'dontInvert' })?.data
  }

  async function toggleTorch() {
    const track = stream?.getVideoTracks()[0]
    if (!track) return
    const on = !torchOn.value
    try {
      await track.applyConstraints({ advanced: [{ torch: on } as MediaTrackConstraintSet] })
      torchOn.value = on
    } catch {
      torchAvailable.value = false
    }
  }

  function stop() {
    clearTimeout(timer)
    stream?.getTracks().forEach((t) => t.stop())
    stream = undefined
    if (video) video.srcObject = null
    torchOn.value = false
    if (state.value !== 'error') state.value = 'off'
  }

  onScopeDispose(stop)
  return { state, problem, torchAvailable, torchOn, start, stop, toggleTorch }
}
