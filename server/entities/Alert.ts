import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm'
import type { AlertKind } from '../../shared/types/domain'

/**
 * Something that needs a storekeeper's attention. `key` identifies the condition (e.g.
 * "low-stock:12"); at most one open alert per key, so a condition alerts once until resolved.
 */
@Entity('alerts')
export class Alert {
  @PrimaryGeneratedColumn()
  id!: number

  @Index()
  @Column({ type: 'varchar', length: 16 })
  kind!: AlertKind

  @Index()
  @Column({ type: 'varchar', length: 64 })
  key!: string

  @Column({ type: 'integer', nullable: true })
  partId!: number | null

  @Column({ type: 'integer', nullable: true })
  lotId!: number | null

  @Column({ type: 'integer', nullable: true })
  buildId!: number | null

  @Column({ type: 'varchar', length: 300 })
  message!: string

  @CreateDateColumn()
  openedAt!: Date

  @Index()
  @Column({ type: 'varchar', length: 30, nullable: true })
  resolvedAt!: string | null

  @Column({ type: 'varchar', length: 30, nullable: true })
  emailedAt!: string | null
}
