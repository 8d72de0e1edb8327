import { Injectable } from '@nestjs/common';
import { type OutboxMessage, outboxMessageSchema } from '@limbus/schema';
import { z } from 'zod';
import { NotFoundError, UnavailableError } from '../common/domain-errors';
import { AppConfig } from '../config/app-config';

export type { OutboxMessage };

/** A catcher that predates the `kind` field answers without it; such a message has no kind. */
const caughtMessagesSchema = z.array(
  outboxMessageSchema.extend({ kind: outboxMessageSchema.shape.kind.optional().transform((k) => k ?? null) }),
);

/** Reads the local SMTP catcher so that demo users can open their e-mails inside Limbus. */
@Injectable()
export class OutboxService {
  constructor(private readonly config: AppConfig) {}

  /** Newest first (the catcher keeps them in arrival order). */
  async messages(): Promise<OutboxMessage[]> {
    if (!this.config.mailCatcherUrl) throw new NotFoundError('No outbox: MAIL_CATCHER_URL is not set');
    let response: Response;
    try {
      response = await fetch(`${this.config.mailCatcherUrl}/messages`, { signal: AbortSignal.timeout(5000) });
    } catch {
      throw new UnavailableError('The mail catcher does not answer');
    }
    if (!response.ok) throw new UnavailableError(`The mail catcher answered ${response.status}`);
    const parsed = caughtMessagesSchema.safeParse(await response.json());
    if (!parsed.success) throw new UnavailableError('The mail catcher sent an unexpected document');
    return parsed.data.reverse();
  }
}
