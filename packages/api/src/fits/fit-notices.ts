import { Injectable, Logger } from '@nestjs/common';
import { escapeHtml, MailService } from '../mail/mail.service';

export interface FitMailContext {
  fitId: string;
  eventId: string;
  eventTitle: string;
}

/**
 * E-mail notices about fits. A notice that cannot be sent is logged, never thrown: the fit's
 * state is already stored and a mail server outage must not undo it.
 */
@Injectable()
export class FitNotices {
  private readonly logger = new Logger(FitNotices.name);

  constructor(private readonly mail: MailService) {}

  fitLink(ctx: FitMailContext): string {
    return this.mail.link(`/events/${ctx.eventId}/fits/${ctx.fitId}`);
  }

  async send(to: string, subject: string, lines: string[], ctx: FitMailContext): Promise<void> {
    const link = this.fitLink(ctx);
    try {
      await this.mail.send({
        to,
        subject,
        text: [...lines, '', `Open the fit: ${link}`].join('\n'),
        html: `${lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('')}<p><a href="${escapeHtml(link)}">Open the fit</a></p>`,
      });
    } catch (error) {
      this.logger.warn(`notice to ${to} not sent: ${error instanceof Error ? error.message : String(error)}`);
    }
  }
}
