// How a station looks by its predicted outlook and its status, on the shadow-path map, in its legend and
// on the coverage plot alike. Colours from the Okabe–Ito palette, distinct for the common forms of
// colour-vision deficiency: M. Okabe and K. Ito, "Color Universal Design (CUD): how to make figures and
// presentations that are friendly to colorblind people" (2002, revised 2008), jfly.uni-koeln.de/color.
// Shape and fill differ for every outlook, so the look reads without colour.
import type { StationOutlook, StationStatus } from '@limbus/schema/planning';
import { symbol, symbolCircle, symbolDiamond, symbolStar, symbolX } from 'd3';

export const outlookLook: Record<
  StationOutlook,
  { shape: 'circle' | 'diamond' | 'x' | 'star'; fill: string; stroke: string; strokeWidth: number }
> = {
  inside: { shape: 'circle', fill: '#0072B2', stroke: '#000000', strokeWidth: 1.25 },
  'ring-only': { shape: 'diamond', fill: '#CC79A7', stroke: '#000000', strokeWidth: 1.25 },
  outside: { shape: 'circle', fill: '#ffffff', stroke: '#000000', strokeWidth: 1.25 },
  'star-down': { shape: 'x', fill: 'none', stroke: '#000000', strokeWidth: 2 },
  'sun-up': { shape: 'star', fill: '#E69F00', stroke: '#000000', strokeWidth: 1.25 },
};

const SHAPES = { circle: symbolCircle, diamond: symbolDiamond, x: symbolX, star: symbolStar } as const;

/** The SVG path of an outlook's marker, centred on 0,0, of the given area in square pixels. */
export function outlookSymbolPath(outlook: StationOutlook, areaPx = 90): string {
  return symbol(SHAPES[outlookLook[outlook].shape], areaPx)() ?? '';
}

/** A marker's outline says where the station stands: solid, dashed (planned), dotted (proposed). */
export const statusDash: Record<StationStatus, string | null> = {
  observing: null,
  planned: '3 2',
  proposed: '1 2',
};
