import { Module } from '@nestjs/common';
import { AuthModule } from '../auth/auth.module.js';
import { MethodsController } from './methods.controller.js';
import { MethodsService } from './methods.service.js';

@Module({
  imports: [AuthModule],
  controllers: [MethodsController],
  providers: [MethodsService],
  exports: [MethodsService],
})
export class MethodsModule {}
