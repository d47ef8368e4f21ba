import { Column, Entity, PrimaryColumn } from 'typeorm'

/** Workshop settings an admin can change (drill set, label defaults, e-mail recipients …). */
@Entity('settings')
export class Setting {
  @PrimaryColumn({ type: 'varchar', length: 64 })
  key!: string

  @Column({ type: 'simple-json' })
  value!: unknown
}
