import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm'
import type { MovementKind } from '../../shared/types/domain'

/**
 * The append-only ledger. Each row moves a positive quantity out of one lot, into one lot, or
 * from one to the other; a lot's quantity is Σ(into) − Σ(out of). Rows are never updated.
 */
@Entity('movements')
export class Movement {
  @PrimaryGeneratedColumn()
  id!: number

  @Index()
  @Column({ type: 'varchar', length: 16 })
  kind!: MovementKind

  @Index()
  @Column({ type: 'integer' })
  partId!: number

  @Column({ type: 'float' })
  quantity!: number

  @Index()
  @Column({ type: 'integer', nullable: true })
  fromLotId!: number | null

  @Index()
  @Column({ type: 'integer', nullable: true })
  toLotId!: number | null

  @Index()
  @Column({ type: 'integer', nullable: true })
  fromBinId!: number | null

  @Index()
  @Column({ type: 'integer', nullable: true })
  toBinId!: number | null

  @Index()
  @Column({ type: 'integer', nullable: true })
  buildId!: number | null

  @Index()
  @Column({ type: 'integer', nullable: true })
  purchaseOrderId!: number | null

  @Index()
  @Column({ type: 'integer' })
  userId!: number

  @Column({ type: 'varchar', length: 300, default: '' })
  reason!: string

  /** The movement this one reverses, when it was made by "undo" from the ledger. */
  @Column({ type: 'integer', nullable: true })
  reversesId!: number | null

  @Index()
  @CreateDateColumn()
  at!: Date
}
