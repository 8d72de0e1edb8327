// Placement of more sites: where the planned and observing stations leave gaps across the body (and its
// rings), and the nearest ground point at night with the star up on each suggested offset line.
import { suggestSites } from '@limbus/geometry';
import { PLACEMENT_CRITERIA, type PlacementAnswer, type PlacementQuery } from '@limbus/schema';
import type { PlanningSnapshot } from './prediction-cache';

/** A station id for a suggestion: the side and offset, e.g. "plan-l120" (120 km left of the centre). */
function suggestedCode(crossTrackKm: number, taken: Set<string>): string {
  const base = `plan-${crossTrackKm >= 0 ? 'l' : 'r'}${Math.round(Math.abs(crossTrackKm))}`;
  let code = base;
  for (let i = 2; taken.has(code); i++) code = `${base}-${i}`;
  taken.add(code);
  return code;
}

export function placementOf(snapshot: PlanningSnapshot, query: PlacementQuery): PlacementAnswer {
  const { settings, prediction } = snapshot;
  const counted = snapshot.stations
    .map((s, i) => ({ station: s, predicted: prediction.stations[i] }))
    .filter(({ station }) => station.status !== 'proposed');
  const search = suggestSites(snapshot.file, settings, prediction, {
    sites: query.sites,
    ringsToo: query.ringsToo,
    region: query.region ?? null,
    stations: counted.map(({ station, predicted }) => {
      if (predicted?.station !== station.code) throw new Error(`prediction out of step with ${station.code}`);
      return { crossTrackKm: predicted.crossTrackKm, latDeg: station.latDeg, lonDeg: station.lonDeg };
    }),
    sunAltitudeBelowDeg: PLACEMENT_CRITERIA.sunAltitudeBelowDeg,
    starAltitudeAboveDeg: PLACEMENT_CRITERIA.starAltitudeAboveDeg,
  });
  const taken = new Set(snapshot.stations.map((s) => s.code));
  const sigma = search.sigmaCrossTrackKm;
  const cautions = [
    `Gaps are measured on the predicted path. An error of the path moves every chord together (1σ ±${sigma.toFixed(1)} km across the track), so the body's edges may fall that far, or farther, from where they are drawn.`,
    `A site is usable here when the Sun is below ${PLACEMENT_CRITERIA.sunAltitudeBelowDeg}° (nautical twilight over: dark enough for the bright stars occultations use) and the star above ${PLACEMENT_CRITERIA.starAltitudeAboveDeg}° (airmass below about 3: less extinction and scintillation, and clear of most horizons).`,
    'A suggested point is only a place on a line: before planning it, check road access at night, whose land it is (ask the owner), the horizon towards the star and local rules.',
    'Ground points are at height 0 on the WGS84 ellipsoid; a site well above it sees the path shifted towards the star.',
  ];
  if (query.ringsToo && settings.rings.length === 0)
    cautions.push('The prediction settings name no rings: only the body is covered.');
  return {
    bodyRadiusKm: settings.bodyRadiusKm,
    ringsToo: query.ringsToo,
    spanKm: search.span,
    sigmaCrossTrackKm: sigma,
    stations: counted.map(({ station, predicted }) => ({
      stationId: station.id,
      code: station.code,
      status: station.status,
      crossTrackKm: predicted?.crossTrackKm ?? 0,
    })),
    gapsBefore: search.gapsBefore.map((g) => ({ fromKm: g.fromKm, toKm: g.toKm, widthKm: g.widthKm })),
    largestGapKmBefore: search.largestGapKmBefore,
    largestGapKmAfter: search.largestGapKmAfter,
    // Infinite before when no chord lies in the span (JSON has no infinity).
    worstDistanceKmBefore: Number.isFinite(search.worstDistanceKmBefore)
      ? search.worstDistanceKmBefore
      : null,
    worstDistanceKmAfter: search.worstDistanceKmAfter,
    suggestions: search.suggestions.map((s) => ({
      crossTrackKm: s.crossTrackKm,
      gap: { fromKm: s.gap.fromKm, toKm: s.gap.toKm, widthKm: s.gap.widthKm },
      crosses: s.crosses,
      code: suggestedCode(s.crossTrackKm, taken),
      site: s.site,
      noSiteReason: s.noSiteReason,
    })),
    criteria: {
      sunAltitudeBelowDeg: PLACEMENT_CRITERIA.sunAltitudeBelowDeg,
      starAltitudeAboveDeg: PLACEMENT_CRITERIA.starAltitudeAboveDeg,
      region: query.region ?? null,
      reference: search.reference,
    },
    cautions,
  };
}
