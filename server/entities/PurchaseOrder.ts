import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm'
import type { OrderStatus } from '../../shared/types/domain'

@Entity('purchase_orders')
export class PurchaseOrder {
  @PrimaryGeneratedColumn()
  id!: number

  /** Human order number, e.g. "PO-0007". */
  @Column({ type: 'varchar', length: 24, unique: true })
  number!: string

  @Index()
  @Column({ type: 'integer' })
  supplierId!: number

  @Index()
  @Column({ type: 'varchar', length: 16, default: 'draft' })
  status!: OrderStatus

  @Column({ type: 'integer' })
  createdById!: number

  /** ISO timestamps and dates kept as text so both databases store them alike. */
  @Column({ type: 'varchar', length: 30, nullable: true })
  sentAt!: string | null

  @Column({ type: 'varchar', length: 10, nullable: true })
  expectedOn!: string | null

  @Column({ type: 'text', default: '' })
  notes!: string

  @CreateDateColumn()
  createdAt!: Date
}
