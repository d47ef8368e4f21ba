import { Column, Entity, Index, PrimaryColumn } from 'typeorm'

/** Server-side sessions (express-session store), kept in the database rather than memory. */
@Entity('sessions')
export class SessionRecord {
  @PrimaryColumn({ type: 'varchar', length: 128 })
  sid!: string

  @Column({ type: 'text' })
  data!: string

  /** Milliseconds since the epoch; expired rows are swept periodically. */
  @Index()
  @Column({ type: 'bigint' })
  expiresAt!: number
}
