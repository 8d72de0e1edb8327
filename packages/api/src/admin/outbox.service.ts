import { Injectable } from '@nestjs/common';
import { z } from 'zod';
import { NotFoundError, UnavailableError } from '../common/domain-errors';
import { AppConfig } from '../config/app-config';

const CaughtMessageSchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  date: z.string(),
});
export type OutboxMessage = z.infer<typeof CaughtMessageSchema>;

/** Reads the local SMTP catcher so that demo users can open their e-mails inside Limbus. */
@Injectable()
export class OutboxService {
  constructor(private readonly config: AppConfig) {}

  async messages(): Promise<OutboxMessage[]> {
    if (!this.config.mailCatcherUrl) throw new NotFoundError('No outbox: MAIL_CATCHER_URL is not set');
    let response: Response;
    try {
      response = await fetch(`${this.config.mailCatcherUrl}/messages`, { signal: AbortSignal.timeout(5000) });
    } catch {
      throw new UnavailableError('The mail catcher does not answer');
    }
    if (!response.ok) throw new UnavailableError(`The mail catcher answered ${response.status}`);
    const parsed = z.array(CaughtMessageSchema).safeParse(await response.json());
    if (!parsed.success) throw new UnavailableError('The mail catcher sent an unexpected document');
    return parsed.data;
  }
}
