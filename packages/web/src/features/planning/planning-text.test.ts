import { describe, expect, it } from 'vitest';
import { crossTrackText, predictedTimeText, utcAt, windowText } from './planning-text';

describe('planning-text', () => {
  it('utcAt() rounds a UTC instant to the decimals asked for', () => {
    expect(utcAt('2029-09-07T21:32:55.960Z', 1)).toBe('2029-09-07 21:32:56.0 UTC');
    expect(utcAt('2029-09-07T21:32:55.960Z')).toBe('2029-09-07 21:32:56 UTC');
    expect(utcAt('2029-09-07T21:32:55.125Z', 3)).toBe('2029-09-07 21:32:55.125 UTC');
  });

  it('predictedTimeText() writes the time to the decimals its 1σ justifies', () => {
    // Two significant digits of the error, the value to the same place (common practice, no source).
    expect(predictedTimeText({ timeUtc: '2029-09-07T21:32:55.604Z', sigmaSeconds: 0.45 })).toBe(
      '2029-09-07 21:32:55.60 UTC ± 0.45 s',
    );
    expect(predictedTimeText({ timeUtc: '2029-09-07T21:32:55.604Z', sigmaSeconds: 12 })).toBe(
      '2029-09-07 21:32:56 UTC ± 12 s',
    );
    expect(predictedTimeText(null)).toBe('—');
  });

  it('windowText() names the date once when both ends share it', () => {
    expect(windowText('2029-09-07T21:32:44.000Z', '2029-09-07T21:33:18.600Z')).toBe(
      '2029-09-07 21:32:44 – 21:33:19 UTC',
    );
    expect(windowText('2029-09-07T23:59:50.000Z', '2029-09-08T00:00:10.000Z')).toBe(
      '2029-09-07 23:59:50 – 2029-09-08 00:00:10 UTC',
    );
  });

  it('crossTrackText() signs the offset and gives its 1σ in km', () => {
    expect(crossTrackText(42.54, 20.4)).toBe('+43 ± 20 km');
    expect(crossTrackText(-190.24, 2.4)).toBe('−190.2 ± 2.4 km');
  });
});
