import type { DataSource } from 'typeorm';
import { User } from './user.entity.js';

/** Whether the user runs this instance (users.is_operator), read fresh from the table on every call. */
export async function isOperator(dataSource: DataSource, userId: string): Promise<boolean> {
  const user = await dataSource
    .getRepository(User)
    .findOne({ where: { id: userId }, select: { id: true, isOperator: true } });
  return user?.isOperator === true;
}
