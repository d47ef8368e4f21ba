import { Column, Entity, OneToMany, PrimaryGeneratedColumn, type Relation } from 'typeorm'
import { Rack } from './Rack'

@Entity('workshops')
export class Workshop {
  @PrimaryGeneratedColumn()
  id!: number

  @Column({ type: 'varchar', length: 120, unique: true })
  name!: string

  @OneToMany(() => Rack, (rack) => rack.workshop)
  racks!: Relation<Rack[]>
}
