import type { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { AuditEntryView } from '@limbus/schema';
import { User } from '../users/entities/user.entity';
import { AuditEntry } from './entities/audit-entry.entity';

export interface AuditRecord {
  teamId: string;
  eventId: string | null;
  actorId: string | null;
  action: string;
  objectType: string;
  objectId: string;
  detail?: Record<string, unknown>;
}

export type AuditView = AuditEntryView;

/**
 * Entries are persisted into the caller's entity manager, so they commit or roll back with the
 * change they describe; nothing here updates or deletes an entry.
 */
@Injectable()
export class AuditService {
  record(em: EntityManager, record: AuditRecord): void {
    const entry = new AuditEntry(record);
    entry.detail = record.detail ?? null;
    em.persist(entry);
  }

  async forEvent(em: EntityManager, eventId: string): Promise<AuditView[]> {
    const entries = await em.find(AuditEntry, { eventId }, { orderBy: { createdAt: 'asc', id: 'asc' } });
    // Actors are ids, not keys, so an entry outlives its actor; a removed account shows no name.
    const actorIds = [...new Set(entries.map((e) => e.actorId).filter((id): id is string => id !== null))];
    const actors =
      actorIds.length === 0 ? [] : await em.find(User, { id: { $in: actorIds } }, { fields: ['id', 'name'] });
    const names = new Map(actors.map((u) => [u.id, u.name]));
    return entries.map((e) => ({
      id: e.id,
      actorId: e.actorId,
      actorName: e.actorId === null ? null : (names.get(e.actorId) ?? null),
      action: e.action,
      objectType: e.objectType,
      objectId: e.objectId,
      detail: e.detail,
      createdAt: e.createdAt.toISOString(),
    }));
  }
}
