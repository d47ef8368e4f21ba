import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'
import type { Role } from '../../shared/types/api'

@Entity('users')
export class User {
  @PrimaryGeneratedColumn()
  id!: number

  @Column({ type: 'varchar', length: 64, unique: true })
  username!: string

  @Column({ type: 'varchar', length: 120 })
  displayName!: string

  @Column({ type: 'varchar', length: 16 })
  role!: Role

  @Column({ type: 'varchar', length: 100 })
  passwordHash!: string

  @Column({ type: 'boolean', default: true })
  active!: boolean

  /** E-mail for alert digests (storekeepers) and order copies; optional. */
  @Column({ type: 'varchar', length: 200, nullable: true })
  email!: string | null

  @CreateDateColumn()
  createdAt!: Date
}
