import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useSignedIn } from './app-layout';
import { getBody } from '@/features/bodies/api/get-body';
import type { EventDetail } from '@/features/event-setup/api/get-event';
import {
  PredictionSettingsForm,
  type OffsetFitCandidate,
} from '@/features/event-setup/components/prediction-settings-form';
import { getFit } from '@/features/fits/api/get-fit';
import { getFits } from '@/features/fits/api/get-fits';

// Composes the bodies and fits features into the prediction settings of the event's Setup (event.tsx
// mounts it): the candidate fits for "Use the offset of fit…" are the body's earlier events' solved fits.

/** At most this many fits are opened for their astrometry, the newest first (one request each). */
const MAX_FITS_OPENED = 30;

/** Solved fits of earlier events of the event's body that measured an astrometric offset, newest event first. */
async function offsetFitCandidates(event: EventDetail, signal: AbortSignal): Promise<OffsetFitCandidate[]> {
  const body = await getBody(event.bodyId, signal);
  const earlier = body.events.filter((e) => e.id !== event.id && e.eventTimeUtc < event.eventTimeUtc);
  const fitLists = await Promise.all(
    earlier.map(async (e) => ({ event: e, fits: await getFits(e.id, signal) })),
  );
  const solved = fitLists
    .flatMap(({ event: e, fits }) => fits.filter((f) => f.state === 'solved').map((f) => ({ e, f })))
    .sort(
      (a, b) =>
        b.e.eventTimeUtc.localeCompare(a.e.eventTimeUtc) || b.f.createdAt.localeCompare(a.f.createdAt),
    )
    .slice(0, MAX_FITS_OPENED);
  const opened = await Promise.all(solved.map(async ({ e, f }) => ({ e, fit: await getFit(f.id, signal) })));
  return opened.flatMap(({ e, fit }) => {
    const astrometry = fit.solution?.astrometry ?? null;
    if (astrometry === null) return [];
    return [
      {
        fitId: fit.id,
        eventId: e.id,
        eventTitle: e.title,
        eventTimeUtc: e.eventTimeUtc,
        reviewState: fit.reviewState,
        referenceTimeUtc: astrometry.referenceTimeUtc,
        offsetMas: { raCosDec: astrometry.raOffsetCosDecMas, dec: astrometry.decOffsetMas },
        uncertaintyMas: {
          raCosDec: astrometry.uncertainty.raOffsetCosDecMas,
          dec: astrometry.uncertainty.decOffsetMas,
        },
      },
    ];
  });
}

/** The prediction settings in Setup: coordinators edit them, modellers read them. */
export function EventPredictionSettingsSection({ event }: { event: EventDetail }) {
  const { me } = useSignedIn();
  const roles = me.teams.find((t) => t.id === event.teamId)?.roles ?? [];
  // Site admins pass every role check on the server; the desk offers them the same controls.
  const canEdit = me.isAdmin || roles.includes('coordinator');
  const [wanted, setWanted] = useState(false);
  const candidates = useQuery({
    queryKey: ['bodies', event.bodyId, 'offset-fits', event.id],
    queryFn: ({ signal }) => offsetFitCandidates(event, signal),
    enabled: wanted,
  });
  return (
    <PredictionSettingsForm
      event={event}
      canEdit={canEdit}
      offsetFits={{ candidates: candidates.data, isPending: candidates.isPending, error: candidates.error }}
      onOpenOffsetFits={() => setWanted(true)}
    />
  );
}
