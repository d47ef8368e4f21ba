import { Column, Entity, ManyToOne, OneToMany, PrimaryGeneratedColumn, type Relation } from 'typeorm'
import { Workshop } from './Workshop'
import { Bin } from './Bin'

@Entity('racks')
export class Rack {
  @PrimaryGeneratedColumn()
  id!: number

  /** Short code that starts its bins' codes, e.g. "A3". */
  @Column({ type: 'varchar', length: 16, unique: true })
  code!: string

  @Column({ type: 'varchar', length: 120 })
  name!: string

  @Column({ type: 'integer' })
  workshopId!: number

  @ManyToOne(() => Workshop, (w) => w.racks, { onDelete: 'RESTRICT' })
  workshop!: Relation<Workshop>

  @OneToMany(() => Bin, (bin) => bin.rack)
  bins!: Relation<Bin[]>
}
