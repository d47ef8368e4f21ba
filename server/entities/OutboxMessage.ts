import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm'

/** Every e-mail the app sends, with its delivery state, so a failed send is retried, never lost. */
@Entity('outbox_messages')
export class OutboxMessage {
  @PrimaryGeneratedColumn()
  id!: number

  @Column({ type: 'varchar', length: 500 })
  to!: string

  @Column({ type: 'varchar', length: 300 })
  subject!: string

  @Column({ type: 'text' })
  text!: string

  @Column({ type: 'text', nullable: true })
  html!: string | null

  /** Attachments as { filename, contentType, base64 }. */
  @Column({ type: 'simple-json', default: '[]' })
  attachments!: { filename: string; contentType: string; base64: string }[]

  /** queued → sent, or failed after the last retry. */
  @Index()
  @Column({ type: 'varchar', length: 12, default: 'queued' })
  status!: string

  @Column({ type: 'integer', default: 0 })
  tries!: number

  @Column({ type: 'varchar', length: 500, nullable: true })
  lastError!: string | null

  @CreateDateColumn()
  createdAt!: Date

  @Column({ type: 'varchar', length: 30, nullable: true })
  sentAt!: string | null
}
