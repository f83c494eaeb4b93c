import { Module } from '@nestjs/common';
import { ConfigModule } from '@nestjs/config';
import { APP_FILTER, APP_GUARD } from '@nestjs/core';
import { ServeStaticModule } from '@nestjs/serve-static';
import { ThrottlerModule } from '@nestjs/throttler';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { AuditModule } from './audit/audit.module.js';
import { AuditReviewModule } from './audit-review/audit-review.module.js';
import { AuthModule } from './auth/auth.module.js';
import { ComparisonsModule } from './comparisons/comparisons.module.js';
import { AllExceptionsFilter } from './common/filters/all-exceptions.filter.js';
import { JwtAuthGuard } from './common/guards/jwt-auth.guard.js';
import { RolesGuard } from './common/guards/roles.guard.js';
import { appConfig } from './config/app.config.js';
import { DatabaseModule } from './database/database.module.js';
import { EvaluateModule } from './evaluate/evaluate.module.js';
import { HealthModule } from './health/health.module.js';
import { MailModule } from './mail/mail.module.js';
import { MethodsModule } from './methods/methods.module.js';
import { NotificationsModule } from './notifications/notifications.module.js';
import { PreparationsModule } from './preparations/preparations.module.js';
import { ReferenceMaterialsModule } from './reference-materials/reference-materials.module.js';
import { OverviewModule } from './overview/overview.module.js';
import { QualificationModule } from './qualification/qualification.module.js';
import { ReportsModule } from './reports/reports.module.js';
import { ReviewsModule } from './reviews/reviews.module.js';
import { RunsModule } from './runs/runs.module.js';
import { StudiesModule } from './studies/studies.module.js';
import { UsersModule } from './users/users.module.js';
import { WorkersModule } from './workers/workers.module.js';
import { AccountThrottlerGuard } from './common/guards/account-throttler.guard.js';

const frontendDist = fileURLToPath(new URL('../../frontend/dist', import.meta.url));

/** Hashed build files never change under their name: cache them for a year; index.html is checked every time. */
function cacheHeaders(res: { setHeader(name: string, value: string): void }, path: string): void {
  res.setHeader('Cache-Control', /[\\/]assets[\\/]/.test(path) ? 'public, max-age=31536000, immutable' : 'no-cache');
}

@Module({
  imports: [
    ConfigModule.forRoot({ isGlobal: true, ignoreEnvFile: true, load: [appConfig] }),
    ThrottlerModule.forRoot([{ ttl: 60_000, limit: 1200 }]),
    ...(existsSync(frontendDist)
      ? [ServeStaticModule.forRoot({ rootPath: frontendDist, exclude: ['/api/{*path}'], serveStaticOptions: { setHeaders: cacheHeaders } })]
      : []),
    DatabaseModule,
    WorkersModule,
    AuditModule,
    MailModule,
    UsersModule,
    AuthModule,
    HealthModule,
    // Before MethodsModule: /method-versions/compare must win over /method-versions/:id.
    ComparisonsModule,
    MethodsModule,
    StudiesModule,
    EvaluateModule,
    NotificationsModule,
    ReviewsModule,
    ReportsModule,
    RunsModule,
    ReferenceMaterialsModule,
    PreparationsModule,
    AuditReviewModule,
    QualificationModule,
    OverviewModule,
  ],
  providers: [
    { provide: APP_FILTER, useClass: AllExceptionsFilter },
    { provide: APP_GUARD, useClass: AccountThrottlerGuard },
    { provide: APP_GUARD, useClass: JwtAuthGuard },
    { provide: APP_GUARD, useClass: RolesGuard },
  ],
})
export class AppModule {}
