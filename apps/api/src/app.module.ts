import { Module, type DynamicModule, type MiddlewareConsumer, type NestModule } from '@nestjs/common';
import { APP_GUARD } from '@nestjs/core';
import { TypeOrmModule } from '@nestjs/typeorm';
import { DataSource, type DataSourceOptions } from 'typeorm';
import type { AppConfig } from './config/app-config.js';
import { AppConfigModule } from './config/app-config.module.js';
import { databaseOptions } from './database/options.js';
import { boundPoolWaits, poolOf, requestSignal } from './database/pool-wait.js';
import { MailModule } from './infrastructure/mail/mail.module.js';
import { StorageModule } from './infrastructure/storage/storage.module.js';
import { AppInfoController } from './modules/app-info/app-info.controller.js';
import { AuditModule } from './modules/audit/audit.module.js';
import { AuthModule } from './modules/auth/auth.module.js';
import { JwtAuthGuard } from './modules/auth/jwt-auth.guard.js';
import { BoardModule } from './modules/board/board.module.js';
import { HandoversModule } from './modules/handovers/handovers.module.js';
import { HazardsModule } from './modules/hazards/hazards.module.js';
import { HeadingsModule } from './modules/headings/headings.module.js';
import { HealthModule } from './modules/health/health.module.js';
import { LocalMailModule } from './modules/local-mail/local-mail.module.js';
import { LongSectionsModule } from './modules/long-sections/long-sections.module.js';
import { NoticeSettingsModule } from './modules/notice-settings/notice-settings.module.js';
import { PhotosModule } from './modules/photos/photos.module.js';
import { ProjectsModule } from './modules/projects/projects.module.js';
import { RoundsModule } from './modules/rounds/rounds.module.js';
import { SupportClassesModule } from './modules/support-classes/support-classes.module.js';
import { SupportRecordsModule } from './modules/support-records/support-records.module.js';
import { TeamModule } from './modules/team/team.module.js';
import { TriggerRulesModule } from './modules/trigger-rules/trigger-rules.module.js';

@Module({})
export class AppModule implements NestModule {
  static forRoot(config: AppConfig): DynamicModule {
    return {
      module: AppModule,
      imports: [
        AppConfigModule.forRoot(config),
        TypeOrmModule.forRootAsync({
          useFactory: () => ({ ...databaseOptions(config), retryAttempts: 3, retryDelay: 1000 }),
          // Every wait for a pooled connection is bounded (DB_POOL_WAIT_MS), and shed when its client has gone.
          dataSourceFactory: async (options) => {
            const dataSource = await new DataSource(options as DataSourceOptions).initialize();
            boundPoolWaits(poolOf(dataSource), config.database.poolWaitMs);
            return dataSource;
          },
        }),
        StorageModule,
        MailModule,
        AuditModule,
        AuthModule,
        ProjectsModule,
        HeadingsModule,
        SupportClassesModule,
        TriggerRulesModule,
        TeamModule,
        NoticeSettingsModule,
        RoundsModule,
        PhotosModule,
        HazardsModule,
        SupportRecordsModule,
        HandoversModule,
        BoardModule,
        LongSectionsModule,
        HealthModule,
        LocalMailModule,
        // The API also serves the built web app (setup-app.ts, common/http/web-app.ts): one address.
      ],
      controllers: [AppInfoController],
      providers: [{ provide: APP_GUARD, useClass: JwtAuthGuard }],
    };
  }

  /** Nest middleware runs after the body parsers, so the request's signal reaches its handler and guards. */
  configure(consumer: MiddlewareConsumer): void {
    consumer.apply(requestSignal).forRoutes('{*path}');
  }
}
