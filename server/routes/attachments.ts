import { Router, type RequestHandler, type Response } from 'express'
import multer from 'multer'
import { z } from 'zod'
import type { Config } from '../config'
import { AppError } from '../errors'
import { currentUser, requireRole, requireSignIn } from '../middleware/auth'
import { createAttachmentService } from '../services/attachments'
import { contentDisposition, fromMultipartName } from '../services/upload-files'
import { attachmentId, attachmentListQuery, attachmentOwner } from '../../shared/schemas/attachment'
import { THUMB_WIDTHS } from '../../shared/types/attachment'

/** Browsers may keep a file a day: stored files never change under their id. Private: signed-in only. */
const FILE_CACHE_CONTROL = 'private, max-age=86400'
/** Served files are data, never pages: no scripts, no plugins, even if a browser were to render one. */
const FILE_CSP = "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; sandbox"

const thumbWidth = z.coerce.number().pipe(z.union(THUMB_WIDTHS.map((w) => z.literal(w))))

/** /api/attachments: drawings and sketches on parts and builds. */
export function attachmentsRouter(config: Config) {
  const service = createAttachmentService(config)
  void service.resumePending().catch(() => undefined)
  const { maxBytes } = service.rules()
  const receive = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 4, parts: 5 },
  }).single('file')
  /** multer, with the limit named in its 413 so the uploader knows what would fit. */
  const upload: RequestHandler = (req, res, next) => receive(req, res, (err?: unknown) => {
    const code = (err as { code?: string } | undefined)?.code
    if (!err || err instanceof AppError) return next(err)
    // busboy's own parse errors ("Malformed part header", "Unexpected end of form") carry no code.
    if (!code) return next(new AppError(400, 'MALFORMED_UPLOAD', 'The upload is not a well-formed multipart form.'))
    if (code !== 'LIMIT_FILE_SIZE') return next(err)
    next(new AppError(413, 'FILE_TOO_LARGE',
      `The file is larger than the upload limit of ${config.UPLOAD_MAX_MB} MB.`, { maxBytes }))
  })
  const router = Router()

  /** Sends a stored file with its judged type; images inline, PDFs as a download. */
  async function sendStored(res: Response, file: Awaited<ReturnType<typeof service.fileOf>>) {
    res.set({
      'Content-Type': file.mime,
      'X-Content-Type-Options': 'nosniff',
      'Cache-Control': FILE_CACHE_CONTROL,
      'Content-Security-Policy': FILE_CSP,
      'Content-Disposition': contentDisposition(file.isPdf ? 'attachment' : 'inline', file.name),
    })
    await new Promise<void>((resolve, reject) =>
      res.sendFile(file.path, { dotfiles: 'deny' }, (err) => (err ? reject(err) : resolve())))
  }

  /** Authorises before multer reads the body, so refused uploads are not buffered first. */
  const authoriseUpload: RequestHandler = async (req, res, next) => {
    res.locals.owner = attachmentOwner.parse(req.query)
    await service.authorise(res.locals.owner, currentUser(req))
    next()
  }

  router.get('/rules', requireSignIn, (_req, res) => {
    res.json(service.rules())
  })

  router.get('/', requireSignIn, async (req, res) => {
    res.json(await service.list(attachmentListQuery.parse(req.query)))
  })

  router.post('/', requireRole('builder'), authoriseUpload, upload, async (req, res) => {
    if (!req.file) throw new AppError(400, 'NO_FILE', 'Choose a file to upload (form field "file").')
    const file = { buffer: req.file.buffer, originalname: fromMultipartName(req.file.originalname) }
    res.status(201).json(await service.upload(res.locals.owner, file, currentUser(req)))
  })

  router.get('/:id', requireSignIn, async (req, res) => {
    res.json(await service.get(attachmentId.parse(req.params.id)))
  })

  router.get('/:id/file', requireSignIn, async (req, res) => {
    await sendStored(res, await service.fileOf(attachmentId.parse(req.params.id)))
  })

  router.get('/:id/thumb/:width', requireSignIn, async (req, res) => {
    const width = thumbWidth.parse(req.params.width)
    await sendStored(res, await service.fileOf(attachmentId.parse(req.params.id), width))
  })

  router.delete('/:id', requireRole('builder'), async (req, res) => {
    await service.remove(attachmentId.parse(req.params.id), currentUser(req))
    res.status(204).end()
  })

  return router
}
