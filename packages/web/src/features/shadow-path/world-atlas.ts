// The Earth the shadow-path map is drawn on: Natural Earth's 1:50m land and country borders from the
// world-atlas package, shipped inside the client (no tiles, no network). Loaded on first use as its own
// chunk; read as text so that TypeScript does not type 750 kB of coordinates.
import { feature, mesh } from 'topojson-client';
import type { Feature, FeatureCollection, MultiLineString } from 'geojson';

type Topology = Parameters<typeof feature>[0];
type MeshObject = NonNullable<Parameters<typeof mesh>[1]>;

export interface WorldAtlas {
  land: Feature | FeatureCollection;
  /** Borders between countries only (no coastlines, which the land outline already draws). */
  borders: MultiLineString;
}

let loading: Promise<WorldAtlas> | null = null;

export function loadWorldAtlas(): Promise<WorldAtlas> {
  loading ??= import('world-atlas/countries-50m.json?raw').then(({ default: text }) => {
    const topology = JSON.parse(text) as Topology;
    const countries = topology.objects.countries;
    const land = topology.objects.land;
    if (countries === undefined || land === undefined)
      throw new Error('world-atlas countries-50m.json has no countries or land object');
    return {
      land: feature(topology, land),
      borders: mesh(topology, countries as MeshObject, (a, b) => a !== b),
    };
  });
  return loading;
}
