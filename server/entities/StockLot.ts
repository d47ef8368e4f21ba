import { Column, CreateDateColumn, Entity, Index, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm'
import { Part } from './Part'
import { Bin } from './Bin'

/**
 * Stock of one part in one bin. Counted parts have one lot per bin; each bar piece or offcut
 * is its own lot (quantity = its length in mm); each batch of a compound is its own lot.
 * The quantity is always the sum of the ledger's movements into and out of the lot.
 */
@Entity('stock_lots')
@Index(['partId', 'binId'])
export class StockLot {
  @PrimaryGeneratedColumn()
  id!: number

  @Column({ type: 'integer' })
  partId!: number

  @ManyToOne(() => Part, { onDelete: 'RESTRICT' })
  part!: Relation<Part>

  @Index()
  @Column({ type: 'integer' })
  binId!: number

  @ManyToOne(() => Bin, { onDelete: 'RESTRICT' })
  bin!: Relation<Bin>

  @Column({ type: 'float', default: 0 })
  quantity!: number

  /** Batch or lot number from the container (compounds and oils). */
  @Column({ type: 'varchar', length: 48, nullable: true })
  batchCode!: string | null

  /** ISO date YYYY-MM-DD; batches are drawn first-expiry-first-out. */
  @Column({ type: 'varchar', length: 10, nullable: true })
  expiresOn!: string | null

  @CreateDateColumn()
  createdAt!: Date
}
