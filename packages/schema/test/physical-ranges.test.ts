import { describe, expect, it } from 'vitest';

import {
  createEventPayloadSchema,
  createStationPayloadSchema,
  patchEventPayloadSchema,
  patchStationPayloadSchema,
  siteProposalPayloadSchema,
  validateEventFile,
} from '../src/index.js';
import { validEventJson } from './event-fixture.js';

type Json = Record<string, unknown>;

/** The paths refused in an event file changed in one way (empty when it is accepted). */
function fileRefusals(change: (doc: Json & { star: Json; stations: Json[] }) => void): string[] {
  const doc = validEventJson() as Json & { star: Json; stations: Json[] };
  change(doc);
  const result = validateEventFile(doc);
  return result.ok ? [] : result.problems.map((p) => p.path);
}

/** The paths a payload schema refuses (empty when it is accepted). */
function payloadRefusals(
  schema: { safeParse(v: unknown): { success: boolean; error?: { issues: Array<{ path: PropertyKey[] }> } } },
  value: unknown,
): string[] {
  const result = schema.safeParse(value);
  return result.success ? [] : (result.error?.issues ?? []).map((i) => i.path.map(String).join('.'));
}

const station = (fields: Json): Json => ({
  code: 'north-ridge',
  latDeg: 38.2,
  lonDeg: -4.1,
  heightM: 820,
  ...fields,
});

function eventPayload(star: Json): Json {
  const file = validEventJson();
  return { title: file.title, star: { raDeg: 101.25, decDeg: 18.5, ...star }, ephemeris: file.ephemeris };
}

describe('physical ranges in the event file (only the impossible is refused)', () => {
  it('validateEventFile() takes an airborne station (SOFIA flew at about 13.7 km) and a station below sea level', () => {
    expect(fileRefusals((d) => Object.assign(d.stations[0] ?? {}, { heightM: 13_700 }))).toEqual([]);
    // The Dead Sea shore, about −430 m (from memory).
    expect(fileRefusals((d) => Object.assign(d.stations[0] ?? {}, { heightM: -430 }))).toEqual([]);
  });

  it('validateEventFile() refuses heightM 1e308 and −20 000 m on the station', () => {
    expect(fileRefusals((d) => Object.assign(d.stations[0] ?? {}, { heightM: 1e308 }))).toEqual([
      'stations[0].heightM',
    ]);
    expect(fileRefusals((d) => Object.assign(d.stations[1] ?? {}, { heightM: -20_000 }))).toEqual([
      'stations[1].heightM',
    ]);
  });

  it("validateEventFile() takes Proxima Centauri's parallax (768.07 mas), a negative catalogue parallax and Barnard's star's proper motion", () => {
    // Gaia DR3 values, from memory: Proxima 768.07 mas; Barnard's star μα* −801.55, μδ 10 362.39 mas/yr.
    expect(fileRefusals((d) => Object.assign(d.star, { parallaxMas: 768.07 }))).toEqual([]);
    expect(fileRefusals((d) => Object.assign(d.star, { parallaxMas: -0.3 }))).toEqual([]);
    expect(
      fileRefusals((d) =>
        Object.assign(d.star, { pmRaCosDecMasPerYear: -801.55, pmDecMasPerYear: 10_362.39 }),
      ),
    ).toEqual([]);
  });

  it('validateEventFile() refuses parallaxMas 1e308, a proper motion of 200″/yr and an angular diameter of 2″', () => {
    expect(fileRefusals((d) => Object.assign(d.star, { parallaxMas: 1e308 }))).toEqual(['star.parallaxMas']);
    expect(fileRefusals((d) => Object.assign(d.star, { pmDecMasPerYear: -200_000 }))).toEqual([
      'star.pmDecMasPerYear',
    ]);
    expect(fileRefusals((d) => Object.assign(d.star, { angularDiameterMas: 2000 }))).toEqual([
      'star.angularDiameterMas',
    ]);
  });

  it('validateEventFile() keeps its message for a negative angular diameter', () => {
    const doc = validEventJson() as Json & { star: Json };
    doc.star.angularDiameterMas = -1;
    const result = validateEventFile(doc);
    expect(result.ok ? [] : result.problems).toEqual([
      { path: 'star.angularDiameterMas', message: 'angularDiameterMas must not be negative' },
    ]);
  });
});

describe('physical ranges in the payloads (held to a ground station and a catalogue star)', () => {
  it('createStationPayloadSchema refuses heightM beyond −500…9000 m and takes the ends of the land', () => {
    expect(payloadRefusals(createStationPayloadSchema, station({ heightM: 8849 }))).toEqual([]);
    expect(payloadRefusals(createStationPayloadSchema, station({ heightM: -430 }))).toEqual([]);
    expect(payloadRefusals(createStationPayloadSchema, station({ heightM: 9001 }))).toEqual(['heightM']);
    expect(payloadRefusals(createStationPayloadSchema, station({ heightM: 1e308 }))).toEqual(['heightM']);
    expect(payloadRefusals(patchStationPayloadSchema, { heightM: -501 })).toEqual(['heightM']);
    expect(payloadRefusals(siteProposalPayloadSchema, station({ heightM: 1e308 }))).toEqual(['heightM']);
  });

  it('createStationPayloadSchema holds apertureMm to (0, 40 000] and exposureSeconds to (0, 600]', () => {
    // The Gran Telescopio Canarias, 10.4 m (from memory), and a 20 ms video frame.
    expect(
      payloadRefusals(createStationPayloadSchema, station({ apertureMm: 10_400, exposureSeconds: 0.02 })),
    ).toEqual([]);
    expect(payloadRefusals(createStationPayloadSchema, station({ apertureMm: 50_000 }))).toEqual([
      'apertureMm',
    ]);
    expect(payloadRefusals(createStationPayloadSchema, station({ apertureMm: 0 }))).toEqual(['apertureMm']);
    expect(payloadRefusals(createStationPayloadSchema, station({ exposureSeconds: 601 }))).toEqual([
      'exposureSeconds',
    ]);
  });

  it('createEventPayloadSchema holds the star to ±1000 mas of parallax and ±11 000 mas/yr of proper motion', () => {
    expect(
      payloadRefusals(
        createEventPayloadSchema,
        eventPayload({ parallaxMas: 768.07, pmDecMasPerYear: 10_362.39 }),
      ),
    ).toEqual([]);
    expect(payloadRefusals(createEventPayloadSchema, eventPayload({ parallaxMas: 1e308 }))).toEqual([
      'star.parallaxMas',
    ]);
    // A catalogue's negative parallax (noise for a distant star) comes back whole from Setup.
    expect(payloadRefusals(createEventPayloadSchema, eventPayload({ parallaxMas: -0.3 }))).toEqual([]);
    expect(payloadRefusals(createEventPayloadSchema, eventPayload({ parallaxMas: -1001 }))).toEqual([
      'star.parallaxMas',
    ]);
    expect(payloadRefusals(createEventPayloadSchema, eventPayload({ pmRaCosDecMasPerYear: 12_000 }))).toEqual(
      ['star.pmRaCosDecMasPerYear'],
    );
    expect(payloadRefusals(createEventPayloadSchema, eventPayload({ angularDiameterMas: 1e308 }))).toEqual([
      'star.angularDiameterMas',
    ]);
  });

  it('patchEventPayloadSchema checks the star the same way and still refuses unknown star fields', () => {
    expect(
      payloadRefusals(patchEventPayloadSchema, { star: { raDeg: 1, decDeg: 2, parallaxMas: 1e308 } }),
    ).toEqual(['star.parallaxMas']);
    expect(
      payloadRefusals(patchEventPayloadSchema, { star: { raDeg: 1, decDeg: 2, distancePc: 3 } }),
    ).toEqual(['star']);
  });
});
