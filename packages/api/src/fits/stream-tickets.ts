import { Inject, Injectable } from '@nestjs/common';
import type { StreamTicket } from '@limbus/schema';
import type { Redis } from 'ioredis';
import { z } from 'zod';
import { UnauthorizedError } from '../common/domain-errors';
import { newOpaqueToken, sha256Hex } from '../common/tokens';
import { REDIS } from '../redis/redis.module';

export const STREAM_TICKET_TTL_SECONDS = 60;

const KEY_PREFIX = 'limbus:fit-stream-ticket:';

const ticketHolderSchema = z.object({ userId: z.string(), fitId: z.string() });

/**
 * A browser's EventSource cannot send an Authorization header, and an access token in a URL lands in
 * proxy logs. So a member first asks for a ticket (with the header), then opens the stream with
 * `?ticket=`: the ticket opens that one fit's stream once, within a minute, and is worthless after.
 * Kept in Redis (only its SHA-256), so any API process can take a ticket another one issued.
 */
@Injectable()
export class StreamTickets {
  constructor(@Inject(REDIS) private readonly redis: Redis) {}

  async issue(userId: string, fitId: string): Promise<StreamTicket> {
    const ticket = newOpaqueToken();
    await this.redis.set(
      KEY_PREFIX + sha256Hex(ticket),
      JSON.stringify({ userId, fitId }),
      'EX',
      STREAM_TICKET_TTL_SECONDS,
    );
    return { ticket, expiresInSeconds: STREAM_TICKET_TTL_SECONDS };
  }

  /** Takes the ticket (GETDEL: a second use finds nothing); missing, used, expired or another fit's → 401. */
  async redeem(ticket: string | undefined, fitId: string): Promise<{ userId: string }> {
    if (typeof ticket !== 'string' || ticket === '' || ticket.length > 200)
      throw new UnauthorizedError('This stream needs a ticket: POST /api/fits/:fitId/stream-ticket');
    const stored = await this.redis.getdel(KEY_PREFIX + sha256Hex(ticket));
    const holder = stored === null ? null : ticketHolderSchema.safeParse(JSON.parse(stored));
    if (!holder?.success || holder.data.fitId !== fitId)
      throw new UnauthorizedError('This stream ticket is unknown, used, expired or for another fit');
    return { userId: holder.data.userId };
  }
}
