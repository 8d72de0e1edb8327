import { MikroORM } from '@mikro-orm/mariadb';
import { Injectable, Logger } from '@nestjs/common';
import type { NoticeKind } from '@limbus/schema';
import { User } from '../users/entities/user.entity';
import { escapeHtml, MailService } from './mail.service';

/** One e-mail notice to some users, with a link into the client. */
export interface Notice {
  kind: NoticeKind;
  /** User ids; each gets the notice unless they turned this kind off. */
  to: string[];
  subject: string;
  /** Paragraphs of the body, plain text. */
  lines: string[];
  /** A client path (e.g. `/events/…?section=stations`) and the words of the link. */
  link: { path: string; label: string };
}

/**
 * E-mail notices about work in a team (reports, reviews, fits). They go out after the change they tell
 * of is stored, honour each user's opt-outs, and never fail or slow the request that caused them: a
 * mail server outage is logged, and the stored state stands.
 */
@Injectable()
export class NoticesService {
  private readonly logger = new Logger(NoticesService.name);

  constructor(
    private readonly mail: MailService,
    private readonly orm: MikroORM,
  ) {}

  /** Sends in the background; the caller goes on at once. */
  notify(notice: Notice): void {
    void this.deliver(notice);
  }

  /** Sends and waits (the worker, tests); resolves to the number of e-mails handed to the mail server. */
  async deliver(notice: Notice): Promise<number> {
    const ids = [...new Set(notice.to)];
    if (ids.length === 0) return 0;
    let sent = 0;
    try {
      const users = await this.orm.em
        .fork()
        .find(User, { id: { $in: ids } }, { fields: ['id', 'email', 'noticeOptOuts'] });
      const link = this.mail.link(notice.link.path);
      for (const user of users) {
        if (user.noticeOptOuts.includes(notice.kind)) continue;
        try {
          await this.mail.send({
            to: user.email,
            subject: notice.subject,
            kind: notice.kind,
            text: [...notice.lines, '', `${notice.link.label}: ${link}`, '', OPT_OUT_LINE].join('\n'),
            html:
              notice.lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('') +
              `<p><a href="${escapeHtml(link)}">${escapeHtml(notice.link.label)}</a></p>` +
              `<p><small>${escapeHtml(OPT_OUT_LINE)}</small></p>`,
          });
          sent++;
        } catch (error) {
          this.logger.warn(
            `${notice.kind} notice to ${user.email} not sent: ${error instanceof Error ? error.message : String(error)}`,
          );
        }
      }
    } catch (error) {
      this.logger.warn(
        `${notice.kind} notice not sent: ${error instanceof Error ? error.message : String(error)}`,
      );
    }
    return sent;
  }
}

const OPT_OUT_LINE = 'You can turn notices like this one off under Account in Limbus.';
