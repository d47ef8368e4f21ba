import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm'

@Entity('purchase_lines')
export class PurchaseLine {
  @PrimaryGeneratedColumn()
  id!: number

  @Index()
  @Column({ type: 'integer' })
  orderId!: number

  @Index()
  @Column({ type: 'integer' })
  partId!: number

  /** Units ordered (whole packs × pack size). */
  @Column({ type: 'float' })
  quantity!: number

  @Column({ type: 'float', default: 1 })
  packSize!: number

  @Column({ type: 'float', default: 0 })
  packPrice!: number

  @Column({ type: 'float', default: 0 })
  receivedQuantity!: number
}
