import { Injectable, OnApplicationShutdown } from '@nestjs/common';
import { MAIL_KIND_HEADER, type MailKind } from '@limbus/schema';
import { createTransport, type Transporter } from 'nodemailer';
import { AppConfig } from '../config/app-config';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** Sent as the X-Limbus-Kind header, which the outbox and mail filters read. */
  kind: MailKind;
}

@Injectable()
export class MailService implements OnApplicationShutdown {
  private readonly transport: Transporter;

  constructor(private readonly config: AppConfig) {
    this.transport = createTransport(config.smtpUrl);
  }

  async send({ kind, ...mail }: OutgoingMail): Promise<void> {
    await this.transport.sendMail({
      from: this.config.mailFrom,
      ...mail,
      headers: { [MAIL_KIND_HEADER]: kind },
    });
  }

  /** Absolute link for e-mails; the client routes it (e.g. /invitations/:token). */
  link(pathname: string): string {
    return `${this.config.publicUrl}${pathname}`;
  }

  onApplicationShutdown(): void {
    this.transport.close();
  }
}

/** Minimal escaping for the few values we put into HTML mail bodies. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/** A time as the product writes it: "YYYY-MM-DD hh:mm:ss UTC". */
export function utcText(date: Date): string {
  return `${date.toISOString().slice(0, 19).replace('T', ' ')} UTC`;
}
