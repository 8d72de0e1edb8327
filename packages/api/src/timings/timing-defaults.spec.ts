import { readFileSync } from 'node:fs';
import path from 'node:path';
import { type EventInput, projectEvent, shadowMotionAt } from '@limbus/geometry';
import { describe, expect, it } from 'vitest';
import { ValidationError } from '../common/domain-errors';
import { timingDefaultsOf } from './timing-defaults';

// The invented example event of docs/examples.
const EXAMPLE = JSON.parse(
  readFileSync(path.resolve(__dirname, '../../../../docs/examples/event-example.json'), 'utf8'),
) as EventInput;

const NO_TIMES = { disappearance: null, reappearance: null };

describe('timingDefaultsOf', () => {
  const chord = EXAMPLE.chords.find((c) => c.type === 'positive');
  if (chord?.type !== 'positive') throw new Error('the example has a positive chord');

  const own = { disappearance: chord.disappearance ?? null, reappearance: chord.reappearance ?? null };

  it("takes the speed at the report's own times, equal to the projection's velocity of that chord", () => {
    const defaults = timingDefaultsOf(EXAMPLE, chord.station, own, 0.5);
    const projected = projectEvent(EXAMPLE).chords.find((c) => c.station === chord.station);
    const v = projected?.velocityKmPerS ?? { f: Number.NaN, g: Number.NaN };
    expect(defaults.atFrom).toBe('report');
    expect(Date.parse(defaults.atUtc)).toBe(
      (Date.parse(chord.disappearance?.time ?? '') + Date.parse(chord.reappearance?.time ?? '')) / 2,
    );
    expect(defaults.speedKmPerS).toBeCloseTo(Math.hypot(v.f, v.g), 6);
    expect(defaults.exposureSeconds).toBe(0.5);
  });

  it("without the report's times, falls back to the positive chords' mean mid-time, then to the ephemeris", () => {
    expect(timingDefaultsOf(EXAMPLE, chord.station, NO_TIMES, null).atFrom).toBe('chords');
    const bare = { ...EXAMPLE, chords: [], ringEvents: [] };
    const fromEphemeris = timingDefaultsOf(bare, chord.station, NO_TIMES, null);
    expect(fromEphemeris.atFrom).toBe('ephemeris');
    expect(fromEphemeris.distanceKm).toBeGreaterThan(0);
    expect(fromEphemeris.exposureSeconds).toBeNull();
  });

  it('names the event part to fix when the instant lies outside the ephemeris', () => {
    const late = { sigmaSeconds: 0.1, time: '2031-01-01T00:00:00Z' };
    try {
      timingDefaultsOf(EXAMPLE, chord.station, { disappearance: late, reappearance: null }, null);
      expect.unreachable('outside the ephemeris span');
    } catch (error) {
      expect(error).toBeInstanceOf(ValidationError);
      expect((error as ValidationError).issues[0]?.path).toBe('event.ephemeris');
    }
  });

  describe('edge speeds', () => {
    // The station's track at the report's instant, from the same projection (shadowMotionAt); a round limb
    // put at impact b = 0.9 R to the left of it. Plane geometry: the limb-normal component of v at both
    // edges is v·√(1 − (b/R)²) = 0.436 v (common practice, no source).
    const defaults = timingDefaultsOf(EXAMPLE, chord.station, own, 0.5);
    const motion = shadowMotionAt(EXAMPLE, chord.station, defaults.atUtc);
    const v = motion.velocityKmPerS;
    const speed = Math.hypot(v.f, v.g);
    const radiusKm = 400;
    const centre = {
      fKm: motion.pointKm.fKm + (v.g / speed) * 0.9 * radiusKm,
      gKm: motion.pointKm.gKm - (v.f / speed) * 0.9 * radiusKm,
    };
    const limb = {
      centerFKm: centre.fKm,
      centerGKm: centre.gKm,
      equatorialRadiusKm: radiusKm,
      oblateness: 0,
      positionAngleDeg: 0,
    };
    const rings = [{ ring: 'R1', openingAngleDeg: 31.5, uncertainty: { openingAngleDeg: 0.7 } }];

    it('timingDefaultsOf() takes each edge at the limb-normal speed where the track crosses the latest fit', () => {
      const d = timingDefaultsOf(EXAMPLE, chord.station, own, 0.5, {
        fit: { id: 'fit-1', limb, rings },
        prediction: null,
      });
      expect(d.edgeSpeeds.from).toBe('fit');
      expect(d.edgeSpeeds.fitId).toBe('fit-1');
      expect(d.edgeSpeeds.disappearanceKmPerS).toBeCloseTo(speed * Math.sqrt(1 - 0.81), 9);
      expect(d.edgeSpeeds.reappearanceKmPerS).toBeCloseTo(speed * Math.sqrt(1 - 0.81), 9);
      expect(d.rings).toEqual([
        { ring: 'R1', openingAngleDeg: 31.5, openingAngleSigmaDeg: 0.7, fitId: 'fit-1' },
      ]);
    });

    it("timingDefaultsOf() without a fit takes the prediction's circle about the offset body, then the full speed", () => {
      // The prediction's body shifted by D·offset (mas → rad): put its centre where the limb above is.
      const masPerRad = (180 / Math.PI) * 3.6e6;
      const prediction = {
        bodyRadiusKm: radiusKm,
        offsetMas: {
          raCosDec: (centre.fKm / motion.distanceKm) * masPerRad,
          dec: (centre.gKm / motion.distanceKm) * masPerRad,
        },
      };
      const d = timingDefaultsOf(EXAMPLE, chord.station, own, 0.5, { fit: null, prediction });
      expect(d.edgeSpeeds.from).toBe('prediction');
      expect(d.edgeSpeeds.disappearanceKmPerS).toBeCloseTo(speed * Math.sqrt(1 - 0.81), 6);
      const none = timingDefaultsOf(EXAMPLE, chord.station, own, 0.5);
      expect(none.edgeSpeeds).toMatchObject({
        from: 'full',
        disappearanceKmPerS: speed,
        reappearanceKmPerS: speed,
      });
      expect(none.edgeSpeeds.note).toContain('no solved fit and no prediction settings');
    });

    it("timingDefaultsOf() says so when the track misses the fit's limb, and falls back", () => {
      // Moved a further 2 R away from the (infinite, straight) track, across it.
      const far = {
        ...limb,
        centerFKm: limb.centerFKm + (v.g / speed) * 2 * radiusKm,
        centerGKm: limb.centerGKm - (v.f / speed) * 2 * radiusKm,
      };
      const d = timingDefaultsOf(EXAMPLE, chord.station, own, 0.5, {
        fit: { id: 'fit-2', limb: far, rings: [] },
        prediction: null,
      });
      expect(d.edgeSpeeds.from).toBe('full');
      expect(d.edgeSpeeds.note).toContain("misses the latest solved fit's limb");
    });
  });
});
