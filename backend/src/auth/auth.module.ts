import { Module } from '@nestjs/common';
import { JwtModule } from '@nestjs/jwt';
import { PassportModule } from '@nestjs/passport';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { UsersModule } from '../users/users.module.js';
import { MailModule } from '../mail/mail.module.js';
import { AuthController, SessionSettingsController } from './auth.controller.js';
import { AuthService } from './auth.service.js';
import { BearerTokens } from './bearer-tokens.js';
import { JwtStrategy } from './jwt.strategy.js';
import { LoginAttemptsService } from './login-attempts.service.js';
import { PasswordPolicyService } from './password-policy.service.js';
import { SessionSettingsService } from './session-settings.service.js';
import { SessionsService } from './sessions.service.js';

@Module({
  imports: [
    UsersModule,
    MailModule,
    PassportModule,
    JwtModule.registerAsync({
      inject: [appConfig.KEY],
      useFactory: (config: AppConfigType) => ({ secret: config.jwtSecret, signOptions: { expiresIn: config.jwtExpiresIn as never } }),
    }),
  ],
  controllers: [AuthController, SessionSettingsController],
  providers: [AuthService, BearerTokens, JwtStrategy, LoginAttemptsService, PasswordPolicyService, SessionsService, SessionSettingsService],
  // The account throttler (a global guard, app.module.ts) counts signed-in requests by the verified token.
  exports: [AuthService, BearerTokens],
})
export class AuthModule {}
