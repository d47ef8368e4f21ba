import { existsSync, mkdirSync } from 'node:fs'
import { rm, writeFile } from 'node:fs/promises'
import { join, resolve } from 'node:path'
import { In } from 'typeorm'
import { pino } from 'pino'
import type { Config } from '../config'
import { db, inTransaction } from '../db'
import { Attachment, Build, Part, User } from '../entities'
import { AppError, forbidden, notFound } from '../errors'
import { roleAtLeast, type Page, type Role } from '../../shared/types/api'
import {
  ACCEPTED_MIME_TYPES, THUMB_WIDTHS, type AcceptedMime, type AttachmentDto, type ThumbStatus,
  type ThumbWidth, type UploadRulesDto,
} from '../../shared/types/attachment'
import type { AttachmentOwner } from '../../shared/schemas/attachment'
import { checkImage, displayName, judgeFileType, newStoredName, thumbMime, thumbName } from './upload-files'
import { ThumbnailPool } from './thumbnail-pool'

/** jimp 1.6 decodes these; WebP it cannot (no decoder bundled), so WebP is kept without thumbnails. */
const THUMBNAILED = new Set(['image/png', 'image/jpeg', 'image/gif'])

/** One pool per process, shared by every app instance (tests make several). */
export const thumbnailPool = new ThumbnailPool()

interface Actor { id: number; role: Role }
export interface UploadedFile { buffer: Buffer; originalname: string }

/** Drawings and sketches: storing, listing, serving and deleting, with thumbnails made off-thread. */
export function createAttachmentService(config: Config) {
  const dir = resolve(config.UPLOAD_DIR)
  const thumbsDir = join(dir, 'thumbs')
  mkdirSync(thumbsDir, { recursive: true })
  const log = pino({ level: config.LOG_LEVEL })
  const maxBytes = Math.floor(config.UPLOAD_MAX_MB * 1024 * 1024)

  const originalPath = (a: Attachment) => join(dir, a.storedName)
  const thumbPath = (a: Attachment, w: number) => join(thumbsDir, thumbName(a.storedName, a.mime, w))

  /** Checks the owner exists and that `user` may add or remove its drawings. */
  async function authorise(owner: AttachmentOwner, user: Actor) {
    if (owner.ownerType === 'part') {
      if (!(await db().getRepository(Part).existsBy({ id: owner.ownerId }))) throw notFound('The part')
      if (!roleAtLeast(user.role, 'storekeeper')) {
        throw forbidden("Only storekeepers and admins may change a part's drawings.")
      }
      return
    }
    const build = await db().getRepository(Build).findOneBy({ id: owner.ownerId })
    if (!build) throw notFound('The build')
    const ownsIt = build.ownerId === user.id && roleAtLeast(user.role, 'builder')
    if (!ownsIt && !roleAtLeast(user.role, 'storekeeper')) {
      throw forbidden("Only the build's owner, a storekeeper or an admin may change its drawings.")
    }
  }

  async function ensureOwnerExists(owner: AttachmentOwner) {
    const repo = owner.ownerType === 'part' ? db().getRepository(Part) : db().getRepository(Build)
    if (!(await repo.existsBy({ id: owner.ownerId }))) throw notFound(`The ${owner.ownerType}`)
  }

  async function toDtos(rows: Attachment[]): Promise<AttachmentDto[]> {
    const ids = [...new Set(rows.map((r) => r.uploadedById))]
    const users = ids.length ? await db().getRepository(User).findBy({ id: In(ids) }) : []
    const names = new Map(users.map((u) => [u.id, u.displayName]))
    return rows.map((a) => {
      const base = `/api/attachments/${a.id}`
      return {
        id: a.id, ownerType: a.ownerType, ownerId: a.ownerId, originalName: a.originalName,
        mime: a.mime as AcceptedMime, kind: a.mime === 'application/pdf' ? 'pdf' : 'image',
        sizeBytes: a.sizeBytes, thumbStatus: a.thumbStatus as ThumbStatus,
        uploadedById: a.uploadedById, uploadedByName: names.get(a.uploadedById) ?? 'unknown',
        createdAt: new Date(a.createdAt).toISOString(), fileUrl: `${base}/file`,
        thumbUrls: a.thumbStatus === 'ready' ? { 160: `${base}/thumb/160`, 800: `${base}/thumb/800` } : null,
      }
    })
  }

  async function removeFiles(a: Attachment) {
    const paths = [originalPath(a), ...THUMB_WIDTHS.flatMap((w) => [thumbPath(a, w), thumbPath(a, w) + '.part'])]
    await Promise.all(paths.map((p) => rm(p, { force: true })))
  }

  /** Hands the image to the worker pool; the row turns 'ready' or 'failed' when it answers. */
  function scheduleThumbnails(a: Attachment) {
    const outputs = THUMB_WIDTHS.map((width) => ({ width, path: thumbPath(a, width) }))
    void thumbnailPool.run({ source: originalPath(a), mime: a.mime, outputs }).then(async (result) => {
      const thumbStatus: ThumbStatus = result.ok ? 'ready' : 'failed'
      if (!result.ok) log.warn({ attachmentId: a.id, reason: result.error }, 'no thumbnails for an upload')
      const { affected } = await inTransaction((tx) =>
        tx.update(Attachment, { id: a.id, thumbStatus: 'pending' }, { thumbStatus }))
      // Deleted while the worker ran: the thumbnails just written belong to nobody.
      if (!affected) await removeFiles(a)
    }).catch((err) => log.warn({ err, attachmentId: a.id }, 'could not record the thumbnail result'))
  }

  async function load(id: number) {
    const a = await db().getRepository(Attachment).findOneBy({ id })
    if (!a) throw notFound('The attachment')
    return a
  }

  return {
    authorise,

    rules: (): UploadRulesDto => ({ maxBytes, acceptedTypes: [...ACCEPTED_MIME_TYPES] }),

    /** Stores an upload the route has already authorised; answers before thumbnails exist. */
    async upload(owner: AttachmentOwner, file: UploadedFile, user: Actor): Promise<AttachmentDto> {
      const mime = await judgeFileType(file.buffer)
      checkImage(file.buffer, mime)
      const storedName = newStoredName(mime)
      const path = join(dir, storedName)
      await writeFile(path, file.buffer, { flag: 'wx' })
      const row = await inTransaction((tx) => tx.save(tx.create(Attachment, {
        ...owner, originalName: displayName(file.originalname), storedName, mime,
        sizeBytes: file.buffer.length, thumbStatus: THUMBNAILED.has(mime) ? 'pending' : 'none',
        uploadedById: user.id,
      }))).catch(async (err) => {
        await rm(path, { force: true })
        throw err
      })
      if (row.thumbStatus === 'pending') scheduleThumbnails(row)
      return (await toDtos([row]))[0]
    },

    async list(q: AttachmentOwner & { page: number; pageSize: number }): Promise<Page<AttachmentDto>> {
      await ensureOwnerExists(q)
      const [rows, total] = await db().getRepository(Attachment).findAndCount({
        where: { ownerType: q.ownerType, ownerId: q.ownerId },
        order: { id: 'ASC' }, skip: (q.page - 1) * q.pageSize, take: q.pageSize,
      })
      return { items: await toDtos(rows), total, page: q.page, pageSize: q.pageSize }
    },

    get: async (id: number) => (await toDtos([await load(id)]))[0],

    /** Where a file is on disk and how to serve it; `width` picks a thumbnail. */
    async fileOf(id: number, width?: ThumbWidth) {
      const a = await load(id)
      if (width !== undefined && a.thumbStatus !== 'ready') {
        const why = a.thumbStatus === 'pending' ? 'is still being made' : 'could not be made for this file'
        throw new AppError(404, 'NO_THUMBNAIL', `The thumbnail ${why}.`, { thumbStatus: a.thumbStatus })
      }
      const path = width === undefined ? originalPath(a) : thumbPath(a, width)
      if (!existsSync(path)) throw notFound('The stored file')
      const mime = width === undefined ? a.mime : thumbMime(a.mime)
      return { path, mime, name: a.originalName, isPdf: a.mime === 'application/pdf' }
    },

    async remove(id: number, user: Actor) {
      const a = await load(id)
      await authorise({ ownerType: a.ownerType, ownerId: a.ownerId }, user)
      await inTransaction((tx) => tx.delete(Attachment, { id }))
      await removeFiles(a)
    },

    /** Re-queues images left 'pending' by a stop while their thumbnails were being made. */
    async resumePending() {
      const rows = await db().getRepository(Attachment).findBy({ thumbStatus: 'pending' })
      rows.forEach(scheduleThumbnails)
      return rows.length
    },
  }
}

export type AttachmentService = ReturnType<typeof createAttachmentService>
