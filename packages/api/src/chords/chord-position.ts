import type { EntityManager } from '@mikro-orm/mariadb';
import type { OccultationEvent } from '../events/entities/occultation-event.entity';
import { Chord } from './entities/chord.entity';

/** The position a new chord takes: after the event's last one, so the event file keeps its order. */
export async function nextChordPosition(
  em: EntityManager,
  event: OccultationEvent | string,
): Promise<number> {
  const last = await em.findOne(Chord, { event }, { orderBy: { position: 'desc' }, fields: ['position'] });
  return (last?.position ?? -1) + 1;
}
