import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm'
import type { BuildStatus } from '../../shared/types/domain'

/** An engine project: what it needs is its bill of materials (BuildLine). */
@Entity('builds')
export class Build {
  @PrimaryGeneratedColumn()
  id!: number

  @Column({ type: 'varchar', length: 160 })
  name!: string

  @Column({ type: 'text', default: '' })
  description!: string

  @Index()
  @Column({ type: 'integer' })
  ownerId!: number

  @Index()
  @Column({ type: 'varchar', length: 16, default: 'planned' })
  status!: BuildStatus

  /** ISO date YYYY-MM-DD. */
  @Column({ type: 'varchar', length: 10, nullable: true })
  targetDate!: string | null

  @CreateDateColumn()
  createdAt!: Date

  @UpdateDateColumn()
  updatedAt!: Date
}
