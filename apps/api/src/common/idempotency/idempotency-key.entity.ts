import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

/** A creating request's Idempotency-Key and what it created, so a retried request returns the first result. */
@Entity('idempotency_keys')
export class IdempotencyKey {
  @PrimaryColumn({ name: 'user_id', type: 'uuid' })
  userId: string;

  @PrimaryColumn({ name: 'idempotency_key', type: 'varchar', length: 100 })
  key: string;

  /** What kind of request made it (e.g. "round:create"), so a key reused for something else is refused. */
  @Column({ type: 'varchar', length: 60 })
  scope: string;

  @Column({ name: 'resource_id', type: 'uuid' })
  resourceId: string;

  @CreateDateColumn({
    name: 'created_at',
    type: 'datetime',
    precision: 3,
    default: () => 'CURRENT_TIMESTAMP(3)',
  })
  createdAt: Date;
}
