import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { MailSinkService } from './mail-sink.service.js';
import { MailService } from './mail.service.js';
import { OutboxMessage } from './outbox-message.entity.js';
import { OutboxController } from './outbox.controller.js';

@Module({
  imports: [TypeOrmModule.forFeature([OutboxMessage])],
  controllers: [OutboxController],
  providers: [MailSinkService, MailService],
  exports: [MailService],
})
export class MailModule {}
