import type { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
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

export interface AuditView {
  id: string;
  actorId: string | null;
  action: string;
  objectType: string;
  objectId: string;
  detail: Record<string, unknown> | null;
  createdAt: string;
}

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
    return entries.map((e) => ({
      id: e.id,
      actorId: e.actorId,
      action: e.action,
      objectType: e.objectType,
      objectId: e.objectId,
      detail: e.detail,
      createdAt: e.createdAt.toISOString(),
    }));
  }
}
