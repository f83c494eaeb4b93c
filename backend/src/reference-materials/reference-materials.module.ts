import { Module } from '@nestjs/common';
import { MailModule } from '../mail/mail.module.js';
import { UsersModule } from '../users/users.module.js';
import { ReferenceMaterialsController } from './reference-materials.controller.js';
import { ReferenceMaterialsService } from './reference-materials.service.js';

@Module({
  imports: [MailModule, UsersModule],
  controllers: [ReferenceMaterialsController],
  providers: [ReferenceMaterialsService],
  exports: [ReferenceMaterialsService],
})
export class ReferenceMaterialsModule {}
