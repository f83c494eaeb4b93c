import { Inject, Injectable, Logger, type OnModuleDestroy, type OnModuleInit } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { simpleParser } from 'mailparser';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { Repository } from 'typeorm';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { OutboxMessage } from './outbox-message.entity.js';

/** Development and test mail: a real SMTP server on loopback whose messages land in the outbox table. */
@Injectable()
export class MailSinkService implements OnModuleInit, OnModuleDestroy {
  private readonly logger = new Logger(MailSinkService.name);
  private server: SMTPServer | null = null;
  port: number | null = null;

  constructor(
    @Inject(appConfig.KEY) private readonly config: AppConfigType,
    @InjectRepository(OutboxMessage) private readonly outbox: Repository<OutboxMessage>,
  ) {}

  get enabled(): boolean {
    return this.config.mail.smtpUrl === null;
  }

  async onModuleInit() {
    if (!this.enabled) return;
    this.server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS', 'AUTH'],
      logger: false,
      onData: (stream, session, callback) => {
        simpleParser(stream)
          .then((parsed) =>
            this.outbox.save(
              this.outbox.create({
                from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
                to: session.envelope.rcptTo.map((rcpt) => rcpt.address),
                subject: (parsed.subject ?? '').slice(0, 300),
                text: parsed.text ?? '',
              }),
            ),
          )
          .then(
            () => callback(),
            (error: Error) => callback(error),
          );
      },
    });
    await new Promise<void>((resolve) => this.server!.listen(0, '127.0.0.1', resolve));
    this.port = (this.server.server.address() as AddressInfo).port;
    this.logger.log(`Development mail sink listening on 127.0.0.1:${this.port}; messages appear in the outbox.`);
  }

  async onModuleDestroy() {
    await new Promise<void>((resolve) => (this.server ? this.server.close(() => resolve()) : resolve()));
  }
}
