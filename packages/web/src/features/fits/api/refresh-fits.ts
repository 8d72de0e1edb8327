import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { fitsQueryKey } from './get-fits';

/**
 * Whether a fit still matches its event (`inputMatchesEvent`) changes when the event's data does, not
 * the fit; so when the desk sees new event data, the fits are fetched again rather than showing, from the
 * cache, an old fit as current. `sources` are the loaded pieces of event data (undefined while loading);
 * the query cache keeps a piece's identity while its content is unchanged, so a refetch that brings the
 * same data changes nothing here.
 */
export function useRefreshFitsOnDataChange(eventId: string, sources: readonly unknown[]) {
  const queryClient = useQueryClient();
  const seen = useRef<readonly unknown[] | null>(null);
  useEffect(() => {
    if (sources.some((s) => s === undefined)) return;
    const before = seen.current;
    seen.current = sources;
    if (before === null || before.every((s, k) => s === sources[k])) return;
    void queryClient.invalidateQueries({ queryKey: fitsQueryKey(eventId) });
    void queryClient.invalidateQueries({ queryKey: ['fits'] });
  });
}
