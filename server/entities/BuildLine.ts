import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm'

/** One line of a build's bill of materials: a count, or a length in mm for bar stock. */
@Entity('build_lines')
export class BuildLine {
  @PrimaryGeneratedColumn()
  id!: number

  @Index()
  @Column({ type: 'integer' })
  buildId!: number

  @Index()
  @Column({ type: 'integer' })
  partId!: number

  @Column({ type: 'float' })
  quantity!: number

  /** What the line is for, e.g. "valve chest cover studs". */
  @Column({ type: 'varchar', length: 200, default: '' })
  note!: string

  /** Quantity already drawn from stores for this line (kept with the draw movements). */
  @Column({ type: 'float', default: 0 })
  drawn!: number

  /** Quantity the builder asked to reserve but stores could not cover. */
  @Column({ type: 'float', default: 0 })
  shortQuantity!: number

  /** For bar lines: the number of pieces of `quantity` mm each (quantity is per piece). */
  @Column({ type: 'integer', default: 1 })
  pieces!: number

  @Column({ type: 'integer', default: 0 })
  position!: number
}
