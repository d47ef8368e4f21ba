import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm'

/**
 * Stock held for a build line. Available = on hand − Σ reservations of the part.
 * A reservation shrinks as the line is drawn and is deleted when released or fully drawn.
 */
@Entity('reservations')
export class Reservation {
  @PrimaryGeneratedColumn()
  id!: number

  @Index()
  @Column({ type: 'integer' })
  partId!: number

  @Index()
  @Column({ type: 'integer' })
  buildId!: number

  @Index()
  @Column({ type: 'integer', unique: true })
  buildLineId!: number

  @Column({ type: 'float' })
  quantity!: number

  @Column({ type: 'integer' })
  userId!: number

  @CreateDateColumn()
  createdAt!: Date
}
