import { Column, Entity, Index, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm'
import { Rack } from './Rack'

@Entity('bins')
export class Bin {
  @PrimaryGeneratedColumn()
  id!: number

  /** Human code printed large on the label, e.g. "A3-07". */
  @Column({ type: 'varchar', length: 24, unique: true })
  code!: string

  /** Code the QR label carries; stays the same when the bin is renamed. */
  @Column({ type: 'varchar', length: 32, unique: true })
  labelCode!: string

  @Column({ type: 'varchar', length: 200, default: '' })
  description!: string

  @Index()
  @Column({ type: 'integer' })
  rackId!: number

  @ManyToOne(() => Rack, (r) => r.bins, { onDelete: 'RESTRICT' })
  rack!: Relation<Rack>

  @Column({ type: 'integer', nullable: true })
  defaultPartId!: number | null

  /** A retired bin takes no new stock; only an empty bin can be retired. */
  @Column({ type: 'boolean', default: false })
  retired!: boolean
}
