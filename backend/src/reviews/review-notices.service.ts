import { Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import { Role } from '@meritline/shared';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { MailService, type Letter } from '../mail/mail.service.js';
import { NotificationsService } from '../notifications/notifications.service.js';
import type { ValidationStudy } from '../studies/validation-study.entity.js';
import type { User } from '../users/user.entity.js';
import { UsersService } from '../users/users.service.js';

export type ReviewEvent = 'submitted' | 'returned' | 'approved' | 'release-pending';

const CAUTION =
  'Approval in Meritline supports, and does not replace, the laboratory’s own procedures, qualified review and the regulations that apply.';

/**
 * The in-app notices go in with the transition's transaction; the e-mails go out after it commits,
 * so nobody is told about a change that was rolled back.
 */
@Injectable()
export class ReviewNoticesService {
  constructor(
    private readonly users: UsersService,
    private readonly mail: MailService,
    private readonly notifications: NotificationsService,
  ) {}

  async prepare(
    event: ReviewEvent,
    study: ValidationStudy,
    actor: AuthUser,
    comment: string | null,
    manager: EntityManager,
  ): Promise<() => Promise<void>> {
    const path = `/studies/${study.id}`;
    const link = this.mail.link(path);
    const title = `“${study.title}”`;
    const mails: Letter[] = [];
    let recipients: User[];
    let message: string;

    switch (event) {
      case 'submitted': {
        recipients = (await this.users.findActiveWithRole(Role.Reviewer)).filter(
          (user) => user.id !== study.authorId && !study.editorIds.includes(user.id),
        );
        message = `${actor.name} submitted ${title} for review.`;
        for (const to of recipients) {
          mails.push({
            to,
            subject: `Study awaiting review: ${study.title}`,
            lines: [
              `${actor.name} submitted the validation study ${title} for review and signed it as its author.`,
              '',
              `Open it to review: ${link}`,
            ],
          });
        }
        break;
      }
      case 'returned': {
        recipients = [await this.users.findById(study.authorId)];
        message = `${actor.name} returned ${title}: ${comment ?? ''}`;
        mails.push({
          to: recipients[0],
          subject: `Study returned for changes: ${study.title}`,
          lines: [
            `${actor.name} returned the validation study ${title} to you with this comment:`,
            '',
            indent(comment ?? ''),
            '',
            `Open it to make the changes and resubmit: ${link}`,
          ],
        });
        break;
      }
      case 'release-pending': {
        recipients = (await this.users.findActiveWithRole(Role.QualityManager)).filter(
          (user) => ![study.authorId, actor.id, ...study.editorIds].includes(user.id),
        );
        message = `${actor.name} approved ${title}; it awaits release by a quality manager.`;
        for (const to of recipients) {
          mails.push({
            to,
            subject: `Study awaiting release: ${study.title}`,
            lines: [
              `${actor.name} reviewed and approved the validation study ${title}. The method version requires a release by a quality manager before the study counts as approved.`,
              '',
              `Open it to release: ${link}`,
            ],
          });
        }
        break;
      }
      case 'approved': {
        const author = await this.users.findById(study.authorId);
        const managers = (await this.users.findActiveWithRole(Role.QualityManager)).filter((user) => user.id !== author.id);
        recipients = [author, ...managers.filter((user) => user.id !== actor.id)];
        message = `${title} is approved (signed by ${actor.name}).`;
        for (const to of recipients) {
          mails.push({
            to,
            subject: `Study approved: ${study.title}`,
            lines: [
              `The validation study ${title} is approved; the last signature is by ${actor.name}.`,
              '',
              `Open it: ${link}`,
              '',
              CAUTION,
            ],
          });
        }
        break;
      }
    }

    await this.notifications.notify(
      recipients.map((user) => user.id),
      { kind: `study.${event}`, message, link: path },
      manager,
    );
    return this.mail.letterDelivery(mails);
  }
}

function indent(text: string): string {
  return text
    .split('\n')
    .map((line) => `  ${line}`)
    .join('\n');
}
