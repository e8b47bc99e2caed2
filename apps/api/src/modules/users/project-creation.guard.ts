import { Inject, Injectable, type CanActivate, type ExecutionContext } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import type { AuthUser } from '../../common/auth/auth-user.js';
import { DomainException } from '../../common/errors/domain.exception.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { isOperator } from './operators.js';

/**
 * Creating a project is a permission of the instance: PROJECT_CREATION=anyone lets every signed-in person
 * create one; PROJECT_CREATION=operators only the instance operators (users.is_operator).
 */
@Injectable()
export class ProjectCreationGuard implements CanActivate {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    if (this.config.projectCreation === 'anyone') return true;
    const user = context.switchToHttp().getRequest<{ user?: AuthUser }>().user;
    if (user && (await isOperator(this.dataSource, user.id))) return true;
    throw DomainException.forbidden(
      'On this Roundbook only the people who run it create projects. Ask them to create yours.',
    );
  }
}
