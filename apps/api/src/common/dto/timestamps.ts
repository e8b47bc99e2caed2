import { CreateDateColumn, UpdateDateColumn, VersionColumn } from 'typeorm';

/** Column settings that produce no schema drift on MariaDB (stack-notes §4). */
export const CreatedAt = (): PropertyDecorator =>
  CreateDateColumn({
    name: 'created_at',
    type: 'datetime',
    precision: 3,
    default: () => 'CURRENT_TIMESTAMP(3)',
  });
export const UpdatedAt = (): PropertyDecorator =>
  UpdateDateColumn({
    name: 'updated_at',
    type: 'datetime',
    precision: 3,
    default: () => 'CURRENT_TIMESTAMP(3)',
    onUpdate: 'CURRENT_TIMESTAMP(3)',
  });
export const Version = (): PropertyDecorator => VersionColumn();
