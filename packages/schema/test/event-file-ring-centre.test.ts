import { describe, expect, it } from 'vitest';

import { validateEventFile } from '../src/index.js';
import { validEventJson } from './event-fixture.js';

describe('validateEventFile() fit.ring.centerFrom', () => {
  it('validateEventFile() accepts "joint" and keeps "limb" as the default', () => {
    const joint = validEventJson() as { fit?: Record<string, unknown> };
    joint.fit = { ring: { centerFrom: 'joint' } };
    const result = validateEventFile(joint);
    expect(result.ok && result.event.fit.ring.centerFrom).toBe('joint');
    const plain = validEventJson() as { fit?: Record<string, unknown> };
    delete plain.fit;
    const defaulted = validateEventFile(plain);
    expect(defaulted.ok && defaulted.event.fit.ring.centerFrom).toBe('limb');
  });

  it('validateEventFile() refuses another centre source, naming fit.ring.centerFrom', () => {
    const doc = validEventJson() as { fit?: Record<string, unknown> };
    doc.fit = { ring: { centerFrom: 'middle' } };
    const result = validateEventFile(doc);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems.map((p) => p.path)).toEqual(['fit.ring.centerFrom']);
  });
});
