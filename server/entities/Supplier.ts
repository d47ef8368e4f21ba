import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm'

@Entity('suppliers')
export class Supplier {
  @PrimaryGeneratedColumn()
  id!: number

  @Column({ type: 'varchar', length: 160, unique: true })
  name!: string

  @Column({ type: 'varchar', length: 200, default: '' })
  email!: string

  @Column({ type: 'varchar', length: 200, default: '' })
  website!: string

  @Column({ type: 'integer', default: 7 })
  leadTimeDays!: number

  @Column({ type: 'text', default: '' })
  notes!: string
}
