import { Inject, Injectable, Logger } from '@nestjs/common';
import nodemailer, { type Transporter } from 'nodemailer';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import type { User } from '../users/user.entity.js';
import { MailSinkService } from './mail-sink.service.js';

export interface Mail {
  to: string[];
  subject: string;
  text: string;
}

/** A mail to one user, greeted by name and signed by Meritline. */
export interface Letter {
  to: Pick<User, 'email' | 'name'>;
  subject: string;
  lines: string[];
}

@Injectable()
export class MailService {
  private readonly logger = new Logger(MailService.name);
  private transporter: Transporter | null = null;

  constructor(
    @Inject(appConfig.KEY) private readonly config: AppConfigType,
    private readonly sink: MailSinkService,
  ) {}

  private transport(): Transporter {
    this.transporter ??= this.config.mail.smtpUrl
      ? nodemailer.createTransport(this.config.mail.smtpUrl)
      : nodemailer.createTransport({ host: '127.0.0.1', port: this.sink.port!, secure: false, ignoreTLS: true });
    return this.transporter;
  }

  /** Delivery problems are logged, never allowed to undo the action that triggered the mail. */
  async send(mail: Mail): Promise<void> {
    if (!mail.to.length) return;
    try {
      await this.transport().sendMail({ from: this.config.mail.from, ...mail });
    } catch (error) {
      this.logger.error(`Could not send "${mail.subject}" to ${mail.to.join(', ')}: ${(error as Error).message}`);
    }
  }

  /** Sends the letters when called: after the change they announce has committed. */
  letterDelivery(letters: readonly Letter[]): () => Promise<void> {
    return async () => {
      for (const { to, subject, lines } of letters) {
        await this.send({ to: [to.email], subject, text: [`Hello ${to.name},`, '', ...lines, '', '— Meritline'].join('\n') });
      }
    };
  }

  link(path: string): string {
    return `${this.config.publicUrl}${path}`;
  }

  sendInvitation(user: User, token: string, invitedBy: string) {
    return this.send({
      to: [user.email],
      subject: 'Your Meritline account is ready to set up',
      text: [
        `Hello ${user.name},`,
        '',
        `${invitedBy} invited you to Meritline at ${this.config.laboratoryName}.`,
        'Set your password with this one-time link (valid for 7 days):',
        '',
        this.link(`/accept-invitation?token=${token}`),
        '',
        'If you did not expect this invitation, ignore this message.',
      ].join('\n'),
    });
  }
}
