import { describe, expect, it } from 'vitest';
import { EventDetailCache } from './event-detail.cache';
import type { EventDetail } from './events.service';

const detail = (title: string) =>
  ({ id: 'e1', title, stations: [{ code: 'A' }], chords: [], ringEvents: [] }) as unknown as EventDetail;

describe('EventDetailCache', () => {
  it('answers only for the revision an entry was stored at', () => {
    const cache = new EventDetailCache();
    cache.set('e1', 3, detail('night one'));
    expect(cache.get('e1', 3)?.title).toBe('night one');
    expect(cache.get('e1', 4)).toBeUndefined();
    expect(cache.get('e2', 3)).toBeUndefined();
  });

  it('a newer store replaces the older one', () => {
    const cache = new EventDetailCache();
    cache.set('e1', 3, detail('night one'));
    cache.set('e1', 5, detail('night one, renamed'));
    expect(cache.get('e1', 3)).toBeUndefined();
    expect(cache.get('e1', 5)?.title).toBe('night one, renamed');
  });

  it('freezes what it keeps, nested objects included, so no caller can change a shared view', () => {
    const cache = new EventDetailCache();
    cache.set('e1', 1, detail('night one'));
    const kept = cache.get('e1', 1) as unknown as { title: string; stations: Array<{ code: string }> };
    expect(() => {
      kept.title = 'changed';
    }).toThrow(TypeError);
    expect(() => {
      (kept.stations[0] as { code: string }).code = 'B';
    }).toThrow(TypeError);
  });

  it('drops the least recently read event once full', () => {
    const cache = new EventDetailCache();
    for (let i = 0; i < 500; i += 1) cache.set(`e${i}`, 1, detail(`event ${i}`));
    expect(cache.get('e0', 1)).toBeDefined(); // read: now the most recent
    cache.set('e500', 1, detail('event 500'));
    expect(cache.get('e0', 1)).toBeDefined();
    expect(cache.get('e1', 1)).toBeUndefined();
    expect(cache.get('e500', 1)).toBeDefined();
  });
});

describe('EventDetailCache bounds', () => {
  const sized = (rows: number) =>
    ({
      id: 'e',
      dataSha256: `sha-${rows}`,
      stations: [],
      chords: Array.from({ length: rows - 1 }, () => ({})),
      ringEvents: [],
    }) as unknown as EventDetail;

  it('EventDetailCache.set() keeps at most 100,000 rows of views together, dropping the least recently read', () => {
    const cache = new EventDetailCache();
    // Events at the size limits (EVENT_SIZE_LIMITS: 2,000 + 2,000 + 5,000 rows, plus the event itself).
    for (let i = 0; i < 12; i += 1) cache.set(`big${i}`, 1, sized(9_001));
    expect(cache.keptRows).toBe(11 * 9_001);
    expect(cache.get('big0', 1)).toBeUndefined();
    expect(cache.get('big11', 1)).toBeDefined();
  });

  it('EventDetailCache.dataSha256() keeps the hash of a view that was dropped, for its revision only', () => {
    const cache = new EventDetailCache();
    cache.set('big0', 4, sized(9_001));
    for (let i = 1; i < 12; i += 1) cache.set(`big${i}`, 1, sized(9_001));
    expect(cache.get('big0', 4)).toBeUndefined();
    expect(cache.dataSha256('big0', 4)).toBe('sha-9001');
    expect(cache.dataSha256('big0', 5)).toBeUndefined();
  });
});
