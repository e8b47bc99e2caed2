import { Inject, Injectable, type CanActivate, type ExecutionContext } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import type { AuthUser } from '../../common/auth/auth-user.js';
import { DomainException } from '../../common/errors/domain.exception.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { isOperator } from '../users/operators.js';

/**
 * The local mail view and the jobs view: only in local mode (LOCAL_MODE=true, set explicitly; otherwise
 * 404, as if the routes did not exist) and only for an instance operator (users.is_operator; a project
 * admin is not one), read from the users table on every request.
 */
@Injectable()
export class OperatorGuard implements CanActivate {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    if (!this.config.localMode || !this.config.mail.localInboxDir)
      throw DomainException.notFound('The local mail view');
    const user = context.switchToHttp().getRequest<{ user?: AuthUser }>().user;
    if (user && (await isOperator(this.dataSource, user.id))) return true;
    throw DomainException.forbidden(
      'Only the operator of this Roundbook instance can open the local mail view.',
    );
  }
}
