import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm'

/** A drawing or sketch on a part or a build; files live under UPLOAD_DIR with generated names. */
@Entity('attachments')
@Index(['ownerType', 'ownerId'])
export class Attachment {
  @PrimaryGeneratedColumn()
  id!: number

  @Column({ type: 'varchar', length: 8 })
  ownerType!: 'part' | 'build'

  @Column({ type: 'integer' })
  ownerId!: number

  /** The client's file name, shown to people only; never used as a path. */
  @Column({ type: 'varchar', length: 200 })
  originalName!: string

  @Column({ type: 'varchar', length: 64, unique: true })
  storedName!: string

  /** Content type judged from the file's bytes. */
  @Column({ type: 'varchar', length: 64 })
  mime!: string

  @Column({ type: 'integer' })
  sizeBytes!: number

  /** pending → ready, or failed; PDFs need no thumbnails and are ready at once. */
  @Column({ type: 'varchar', length: 12, default: 'pending' })
  thumbStatus!: string

  @Column({ type: 'integer' })
  uploadedById!: number

  @CreateDateColumn()
  createdAt!: Date
}
