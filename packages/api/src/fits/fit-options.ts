import type { FitOptions } from '@limbus/geometry';

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/**
 * A fit request's options over the event's defaults, key by key at every depth: `{}` keeps the
 * defaults, `{ limb: { modelErrorKm: 5 } }` changes only that key. Lists replace, they do not merge,
 * because a list of stations with fitted clocks is one choice. The result is validated by the caller.
 */
export function overlayFitOptions(defaults: FitOptions, options: Record<string, unknown>): unknown {
  return overlay(defaults, options);
}

function overlay(base: unknown, over: unknown): unknown {
  if (!isPlainObject(base) || !isPlainObject(over)) return over === undefined ? base : over;
  const out: Record<string, unknown> = { ...base };
  for (const [key, value] of Object.entries(over)) out[key] = overlay(base[key], value);
  return out;
}
