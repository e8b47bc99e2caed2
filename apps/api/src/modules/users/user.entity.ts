import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import { CreatedAt, UpdatedAt, Version } from '../../common/dto/timestamps.js';

@Entity('users')
export class User {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'varchar', length: 254, unique: true })
  email: string;

  @Column({ type: 'varchar', length: 120 })
  name: string;

  @Column({ name: 'password_hash', type: 'varchar', length: 255, nullable: true })
  passwordHash: string | null;

  /**
   * Instance operator: runs this Roundbook instance (sees the local mail view and the jobs, and may create
   * projects when PROJECT_CREATION=operators). Not a project role.
   */
  @Column({ name: 'is_operator', type: 'boolean', default: false })
  isOperator: boolean;

  /**
   * Tokens carry the version they were issued under; raising it (sign out everywhere, a new password, removal
   * from the last project) makes every earlier token of the account invalid at its next request.
   */
  @Column({ name: 'token_version', type: 'int', default: 0 })
  tokenVersion: number;

  @CreatedAt()
  createdAt: Date;

  @UpdatedAt()
  updatedAt: Date;

  @Version()
  version: number;
}
