import {
  Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn,
} from 'typeorm'
import type { PartKind } from '../../shared/types/domain'

/**
 * One catalogue entry. Kind-specific attributes live in `attributes` (validated per kind by
 * shared/schemas); the fields search filters on are copied into indexed columns.
 */
@Entity('parts')
@Index(['kind', 'threadKey'])
// Search indexes (migration PartSearchIndexes): filter, count and order by code from the index alone.
@Index('IDX_parts_search_thread', ['threadKey', 'form', 'lengthMm', 'material', 'archived', 'code'])
@Index('IDX_parts_search_form', ['form', 'material', 'sizeMm', 'lengthMm', 'archived', 'code'])
@Index('IDX_parts_search_kind', ['kind', 'sizeMm', 'material', 'archived', 'code'])
@Index('IDX_parts_search_material', ['material', 'sizeMm', 'archived', 'code'])
export class Part {
  @PrimaryGeneratedColumn()
  id!: number

  @Column({ type: 'varchar', length: 48, unique: true })
  code!: string

  @Column({ type: 'varchar', length: 200 })
  name!: string

  @Index()
  @Column({ type: 'varchar', length: 16 })
  kind!: PartKind

  /** Kind-specific attributes, e.g. { type: 'stud', thread: '7BA', lengthMm: 20, material: 'brass' }. */
  @Column({ type: 'simple-json' })
  attributes!: Record<string, unknown>

  /** Fastener type (stud, nut, screw, bolt, washer, pin) or stock section (round, hex …). */
  @Index()
  @Column({ type: 'varchar', length: 16, nullable: true })
  form!: string | null

  /** Normalised thread designation (shared/domain/threads threadKey), for fasteners. */
  @Index()
  @Column({ type: 'varchar', length: 32, nullable: true })
  threadKey!: string | null

  @Column({ type: 'float', nullable: true })
  lengthMm!: number | null

  /** Main size in mm: bar diameter / across flats / width, gasket thickness. */
  @Index()
  @Column({ type: 'float', nullable: true })
  sizeMm!: number | null

  /** Normalised material name (lower case), e.g. "brass", "stainless 303". */
  @Index()
  @Column({ type: 'varchar', length: 40, nullable: true })
  material!: string | null

  /** Unit of measure: "pcs", "mm", "bottle", "tin" … */
  @Column({ type: 'varchar', length: 16, default: 'pcs' })
  unit!: string

  @Column({ type: 'text', default: '' })
  notes!: string

  @Column({ type: 'simple-json', default: '[]' })
  tags!: string[]

  @Column({ type: 'float', default: 0 })
  reorderPoint!: number

  @Column({ type: 'float', default: 0 })
  reorderQuantity!: number

  @Column({ type: 'integer', nullable: true })
  preferredSupplierId!: number | null

  /** Cost of one unit (one item, one mm of bar, one container) in the workshop's currency. */
  @Column({ type: 'float', default: 0 })
  unitCost!: number

  /** Used in pressure-bearing work (boiler fittings): shows the boiler-code caution. */
  @Column({ type: 'boolean', default: false })
  pressureBearing!: boolean

  /** Code the QR label of the part carries. */
  @Column({ type: 'varchar', length: 32, unique: true })
  labelCode!: string

  /** Archived parts stay for the ledger but leave lists and search. */
  @Index()
  @Column({ type: 'boolean', default: false })
  archived!: boolean

  @CreateDateColumn()
  createdAt!: Date

  @UpdateDateColumn()
  updatedAt!: Date
}
