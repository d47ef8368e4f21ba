import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm'

/** A supplier's offer of a part: their code, the pack it comes in and the pack's price. */
@Entity('supplier_parts')
@Index(['supplierId', 'partId'], { unique: true })
export class SupplierPart {
  @PrimaryGeneratedColumn()
  id!: number

  @Column({ type: 'integer' })
  supplierId!: number

  @Index()
  @Column({ type: 'integer' })
  partId!: number

  @Column({ type: 'varchar', length: 64, default: '' })
  supplierCode!: string

  /** Units per pack (items, mm of bar, containers). */
  @Column({ type: 'float', default: 1 })
  packSize!: number

  @Column({ type: 'float', default: 0 })
  packPrice!: number
}
