import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import { exampleMap } from '../../e2e/planning/map-fixture';
import { pathGeoJson, pathKml, splitAtAntimeridian } from './path-exports';

interface GeoFeature {
  type: string;
  properties: {
    line: string;
    ring: string | null;
    sigma: number;
    edge: string;
    part: number;
    fromUtc: string;
  };
  geometry: { type: string; coordinates: Array<[number, number]> };
}

describe('shadow-path exports', () => {
  it('splitAtAntimeridian() cuts a step across ±180° at the meridian, latitude interpolated', () => {
    // By hand: from (179°, −19°) to (−179°, −18°) is 2° of longitude eastwards; the meridian is halfway,
    // at latitude −18.5°.
    const parts = splitAtAntimeridian([
      { timeUtc: 'a', latDeg: -20, lonDeg: 178 },
      { timeUtc: 'b', latDeg: -19, lonDeg: 179 },
      { timeUtc: 'c', latDeg: -18, lonDeg: -179 },
      { timeUtc: 'd', latDeg: -17, lonDeg: -178 },
    ]);
    expect(parts).toEqual([
      [
        [178, -20],
        [179, -19],
        [180, -18.5],
      ],
      [
        [-180, -18.5],
        [-179, -18],
        [-178, -17],
      ],
    ]);
  });

  it('pathGeoJson() writes RFC 7946 LineStrings, [lon, lat], cut at ±180° and at gaps, named by line and ring', () => {
    const doc = JSON.parse(pathGeoJson(exampleMap(), 10)) as {
      type: string;
      limbus: { eventId: string };
      features: GeoFeature[];
    };
    expect(doc.type).toBe('FeatureCollection');
    expect(doc.limbus.eventId).toBe(exampleMap().eventId);
    for (const f of doc.features) {
      expect(f.type).toBe('Feature');
      expect(f.geometry.type).toBe('LineString');
      // RFC 7946 sec. 3.1.4: a LineString has two or more positions; sec. 4: longitude first, in degrees.
      expect(f.geometry.coordinates.length).toBeGreaterThanOrEqual(2);
      for (const [lon, lat] of f.geometry.coordinates) {
        expect(Math.abs(lon)).toBeLessThanOrEqual(180);
        expect(Math.abs(lat)).toBeLessThanOrEqual(90);
      }
    }
    const summary = doc.features.map(
      (f) => `${f.properties.line}/${f.properties.ring ?? '-'}/${f.properties.sigma}/${f.properties.part}`,
    );
    expect(summary).toEqual([
      'central/-/0/0',
      'central/-/0/1',
      'left/-/0/0',
      'left/-/0/1',
      'right/-/0/0',
      'right/-/0/1',
      'left/R1/0/0',
      'left/-/1/0',
    ]);
    const centralEast = doc.features[0];
    expect(centralEast?.geometry.coordinates.at(-1)).toEqual([180, -18.5]);
    expect(doc.features[5]?.properties.fromUtc).toBe('2030-05-01T10:00:40.000Z');
  });

  it('pathKml() writes well-formed KML 2.2 with one Placemark per stretch, coordinates as lon,lat,0', () => {
    const kml = pathKml(exampleMap(), 10);
    expect(XMLValidator.validate(kml)).toBe(true);
    const doc = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '' }).parse(kml) as {
      kml: {
        xmlns: string;
        Document: {
          name: string;
          Style: unknown[];
          Placemark: Array<{ name: string; styleUrl: string; LineString: { coordinates: string } }>;
        };
      };
    };
    expect(doc.kml.xmlns).toBe('http://www.opengis.net/kml/2.2');
    expect(doc.kml.Document.name).toBe('Shadow path: Example <occultation> & test');
    expect(doc.kml.Document.Placemark).toHaveLength(8);
    const first = doc.kml.Document.Placemark[0];
    expect(first?.name).toBe('Central line');
    expect(first?.styleUrl).toBe('#central');
    expect(first?.LineString.coordinates).toBe('178,-20,0 179,-19,0 180,-18.5,0');
    expect(doc.kml.Document.Placemark.map((p) => p.name)).toContain('Left limit of ring R1');
    expect(doc.kml.Document.Placemark.map((p) => p.name)).toContain('Left 1σ band, outer edge');
  });
});
