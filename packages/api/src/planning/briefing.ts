// What each observer is told before the night: their station's predicted times with the ± the path's σ
// implies, when to record, where to point and what else is in the sky, with the cautions about the
// prediction and the usual safety cautions. The briefing page (JSON) and the e-mail say the same things,
// built here once.
import { briefStations, type StationBrief } from '@limbus/geometry';
import { type Briefing, type BriefingStation, STATION_OUTLOOK_LABELS, stationOutlook } from '@limbus/schema';
import type { PlanningSnapshot } from './prediction-cache';
import { offsetAssumptions } from './prediction.service';

/** Below this the star is low: more extinction and scintillation, and trees and hills get in the way. */
const LOW_STAR_DEG = 20;
/** A Moon this close and this lit brightens the sky around the star (common practice, no source). */
const MOON_NEAR_DEG = 15;
const MOON_BRIGHT_FRACTION = 0.5;

export const SAFETY_CAUTIONS = [
  'Driving to a remote site at night: plan the route in daylight, tell someone where you go and when you will be back, carry water, warm clothes and a charged phone, and do not drive tired.',
  'Private land: ask the owner before you set up, and keep to their conditions (gates, livestock, crops, lights).',
  'The Sun: never point a telescope or camera near it. In twilight keep the optics capped until the Sun is well down, and if the Sun is up do not observe at all.',
  'Local laws and rules (traffic, access, parking, lights, fire bans, curfews) come before this briefing; if they forbid a site, do not use it.',
];

const briefs = new WeakMap<PlanningSnapshot, StationBrief[]>();

/** The geometry's numbers for every station, once per cached prediction. */
export function stationBriefs(snapshot: PlanningSnapshot): StationBrief[] {
  let list = briefs.get(snapshot);
  if (!list) {
    list = briefStations(snapshot.file, snapshot.settings, snapshot.prediction);
    briefs.set(snapshot, list);
  }
  return list;
}

function notesFor(station: BriefingStation, sigmaCrossTrackKm: number, radiusKm: number): string[] {
  const notes: string[] = [];
  const p = station.pointing;
  if (station.status === 'proposed')
    notes.push('This site is proposed and not yet accepted by the coordinator.');
  if (p.starAltitudeDeg <= 0)
    notes.push('The star is below the horizon at the predicted time: this site cannot observe it.');
  else if (p.starAltitudeDeg < LOW_STAR_DEG)
    notes.push(
      `The star is only ${p.starAltitudeDeg.toFixed(1)}° up: check the horizon towards azimuth ${p.starAzimuthDeg.toFixed(0)}°.`,
    );
  if (p.sunAltitudeDeg > 0) notes.push(`The Sun is up (${p.sunAltitudeDeg.toFixed(1)}°): do not observe.`);
  else if (p.sunAltitudeDeg > -12)
    notes.push(
      `Twilight: the Sun is ${p.sunAltitudeDeg.toFixed(1)}°; the sky may be too bright for a faint star.`,
    );
  if (
    p.moonSeparationDeg < MOON_NEAR_DEG &&
    p.moonIlluminatedFraction > MOON_BRIGHT_FRACTION &&
    p.moonAltitudeDeg > 0
  )
    notes.push(
      `The Moon is ${p.moonSeparationDeg.toFixed(0)}° from the star and ${(100 * p.moonIlluminatedFraction).toFixed(0)} % lit: expect a bright sky.`,
    );
  const edgeKm = Math.abs(Math.abs(station.crossTrackKm) - radiusKm);
  if (sigmaCrossTrackKm > 0 && edgeKm < 3 * sigmaCrossTrackKm)
    notes.push(
      `The limb passes within 3σ of this site (${edgeKm.toFixed(0)} km, σ ${sigmaCrossTrackKm.toFixed(0)} km): it may see the body or miss it; record the whole watch window.`,
    );
  return notes;
}

/** Every station's briefing entry, in the event's station order. */
export function briefingStations(snapshot: PlanningSnapshot): BriefingStation[] {
  const numbers = stationBriefs(snapshot);
  return snapshot.stations.map((s, i) => {
    const predicted = snapshot.prediction.stations[i];
    const brief = numbers[i];
    if (predicted?.station !== s.code || brief?.station !== s.code)
      throw new Error(`briefing out of step with station ${s.code}`);
    const station: BriefingStation = {
      stationId: s.id,
      code: s.code,
      status: s.status,
      observerId: s.observerId,
      observerName: s.observerName,
      latDeg: s.latDeg,
      lonDeg: s.lonDeg,
      heightM: s.heightM,
      outlook: stationOutlook(predicted),
      closestTimeUtc: predicted.closestTimeUtc,
      distanceKm: predicted.distanceKm,
      crossTrackKm: predicted.crossTrackKm,
      sigmaCrossTrackKm: predicted.sigmaCrossTrackKm,
      speedKmPerS: brief.speedKmPerS,
      disappearance:
        predicted.disappearanceUtc === null
          ? null
          : { timeUtc: predicted.disappearanceUtc, sigmaSeconds: brief.disappearanceSigmaSeconds ?? 0 },
      reappearance:
        predicted.reappearanceUtc === null
          ? null
          : { timeUtc: predicted.reappearanceUtc, sigmaSeconds: brief.reappearanceSigmaSeconds ?? 0 },
      rings: predicted.rings.map((r) => ({ ring: r.ring, window: r.window })),
      watch: brief.watch,
      pointing: brief.pointing,
      notes: [],
    };
    station.notes = notesFor(station, predicted.sigmaCrossTrackKm, snapshot.settings.bodyRadiusKm);
    return station;
  });
}

export function predictionCautions(snapshot: PlanningSnapshot): string[] {
  const { uncertaintyMas } = snapshot.settings;
  return [
    uncertaintyMas.raCosDec === 0 && uncertaintyMas.dec === 0
      ? 'No uncertainty is set for the prediction: the ± on the times are 0, which no real prediction is. Ask the coordinator before trusting them.'
      : `The ± on the times are 1σ, from the stated uncertainty of the body–star offset (${uncertaintyMas.raCosDec} mas in RA·cos Dec, ${uncertaintyMas.dec} mas in Dec); a path can lie farther off than 3σ when the star or the ephemeris is worse than stated.`,
    'Record the whole watch window with a time source you trust (GNSS-disciplined), whatever the predicted times.',
    ...(snapshot.offsetSource === null ? [] : offsetAssumptions(snapshot.offsetSource)),
  ];
}

export function briefingOf(snapshot: PlanningSnapshot, stations: BriefingStation[], link: string): Briefing {
  return {
    eventId: snapshot.eventId,
    eventTitle: snapshot.title,
    bodyName: snapshot.bodyName,
    eventTimeUtc: snapshot.eventTimeUtc,
    bodyRadiusKm: snapshot.settings.bodyRadiusKm,
    closestApproachUtc: snapshot.prediction.closestApproach.timeUtc,
    link,
    offsetSource: snapshot.offsetSource,
    stations,
    predictionCautions: predictionCautions(snapshot),
    safetyCautions: SAFETY_CAUTIONS,
  };
}

/** "2029-09-07 21:41:37.4 UTC": the product's UTC form, with tenths where a contact time needs them. */
export function utcTenths(isoUtc: string): string {
  const ms = Date.parse(isoUtc);
  const tenths = Math.round(ms / 100) * 100;
  const text = new Date(tenths).toISOString();
  return `${text.slice(0, 10)} ${text.slice(11, 21)} UTC`;
}

function utcSeconds(isoUtc: string): string {
  return `${isoUtc.slice(0, 10)} ${isoUtc.slice(11, 19)} UTC`;
}

/** The e-mail's lines for one observer's stations. */
export function briefingMailLines(briefing: Briefing, stations: BriefingStation[]): string[] {
  const lines = [
    `Briefing for "${briefing.eventTitle}" (${briefing.bodyName}). Closest approach of the shadow to the Earth's centre: ${utcSeconds(briefing.closestApproachUtc)}.`,
  ];
  for (const s of stations) {
    const p = s.pointing;
    lines.push(
      '',
      `Station ${s.code} (${s.latDeg.toFixed(4)}°, ${s.lonDeg.toFixed(4)}°, ${s.heightM.toFixed(0)} m): ${STATION_OUTLOOK_LABELS[s.outlook]}.`,
      `Closest approach ${utcTenths(s.closestTimeUtc)}, ${s.distanceKm.toFixed(1)} km from the body's centre; cross-track ${s.crossTrackKm >= 0 ? '+' : ''}${s.crossTrackKm.toFixed(1)} ± ${s.sigmaCrossTrackKm.toFixed(1)} km (1σ).`,
    );
    if (s.disappearance && s.reappearance)
      lines.push(
        `Disappearance ${utcTenths(s.disappearance.timeUtc)} ± ${s.disappearance.sigmaSeconds.toFixed(1)} s; reappearance ${utcTenths(s.reappearance.timeUtc)} ± ${s.reappearance.sigmaSeconds.toFixed(1)} s (1σ).`,
      );
    else lines.push('No disappearance by the body is predicted here.');
    for (const r of s.rings)
      lines.push(
        r.window === null
          ? `Ring ${r.ring}: not crossed as predicted.`
          : `Ring ${r.ring}: from ${utcTenths(r.window[0])} to ${utcTenths(r.window[1])}.`,
      );
    lines.push(
      `Record from ${utcSeconds(s.watch.fromUtc)} to ${utcSeconds(s.watch.toUtc)} (every contact the body or a ring could make with the path moved by up to 3σ).`,
      `Pointing at closest approach: star altitude ${p.starAltitudeDeg.toFixed(1)}°, azimuth ${p.starAzimuthDeg.toFixed(1)}° (from north through east); Sun altitude ${p.sunAltitudeDeg.toFixed(1)}°; Moon ${p.moonSeparationDeg.toFixed(0)}° from the star, ${(100 * p.moonIlluminatedFraction).toFixed(0)} % lit.`,
      ...s.notes,
    );
  }
  lines.push(
    '',
    'About the prediction:',
    ...briefing.predictionCautions,
    '',
    'Safety:',
    ...briefing.safetyCautions,
  );
  return lines;
}
