import { Button, makeStyles, tokens } from '@fluentui/react-components';
import type { PredictionMap } from '@limbus/schema/planning';
import {
  geoGraticule10,
  geoNaturalEarth1,
  geoPath,
  select,
  zoom,
  zoomIdentity,
  type ZoomBehavior,
  type ZoomTransform,
} from 'd3';
import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { bandPolygons, framingFeature, lineFeature, nightCap } from '../map-geometry';
import { mapPalette } from '../map-palette';
import { loadWorldAtlas, type WorldAtlas } from '../world-atlas';
import { MapLegend } from './map-legend';
import { outlookLook, outlookSymbolPath, statusDash } from '@/components/station-look';
import { utcText } from '@/lib/utc-text';

export interface ShadowPathMapProps {
  map: PredictionMap;
  widthPx?: number;
  heightPx?: number;
}

const PAN_PX = 80;
/** Below this altitude the Sun no longer brightens the sky enough to matter for most stars (nautical). */
const DARK_SUN_BELOW_DEG = 12;

const useStyles = makeStyles({
  figure: { margin: 0, display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  controls: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS },
  cautions: { margin: 0, paddingLeft: tokens.spacingHorizontalXL, fontSize: tokens.fontSizeBase200 },
  svg: {
    display: 'block',
    maxWidth: '100%',
    height: 'auto',
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    cursor: 'grab',
    backgroundColor: '#ffffff',
  },
});

export function shadowPathMapLabel(map: PredictionMap): string {
  const rings = new Set(map.lines.filter((l) => l.ring !== null).map((l) => l.ring));
  const parts = [
    `${map.eventTitle}: central line and limits of the body`,
    rings.size > 0 ? `limits of ${rings.size} ring${rings.size === 1 ? '' : 's'}` : null,
    `1σ and 3σ bands (1σ = ${map.sigmaCrossTrackKm.toFixed(1)} km across the path)`,
    `night side at closest approach ${utcText(map.closestApproachUtc)}`,
    `${map.stations.length} station${map.stations.length === 1 ? '' : 's'}`,
  ];
  return `Shadow path map of ${parts.filter((p) => p !== null).join(', ')}`;
}

/**
 * The shadow's path on the Earth (Natural Earth projection, centred on the path): graticule, the night
 * side at closest approach, the bands of the path's uncertainty, the central line, the limits of the body
 * and of each ring, time ticks in UTC, and every station by its outlook. Zoom and pan with the mouse or
 * the buttons; the view is kept while the data refresh.
 */
export function ShadowPathMap({ map, widthPx = 760, heightPx = 500 }: ShadowPathMapProps) {
  const styles = useStyles();
  const svgRef = useRef<SVGSVGElement>(null);
  const zoomRef = useRef<ZoomBehavior<SVGSVGElement, unknown> | null>(null);
  // Kept across re-renders (a new station, a refetch), so the view a person chose stays.
  const transformRef = useRef<ZoomTransform>(zoomIdentity);
  const [atlas, setAtlas] = useState<WorldAtlas | null>(null);
  const [atlasError, setAtlasError] = useState<string | null>(null);
  const clipId = `map-clip-${useId().replace(/[^a-zA-Z0-9_-]/g, '')}`;
  const label = useMemo(() => shadowPathMapLabel(map), [map]);

  useEffect(() => {
    let live = true;
    loadWorldAtlas().then(
      (loaded) => live && setAtlas(loaded),
      (error: unknown) => live && setAtlasError(error instanceof Error ? error.message : String(error)),
    );
    return () => {
      live = false;
    };
  }, []);

  const limits = useMemo(() => map.lines.filter((l) => l.sigma === 0), [map]);
  // The first frame depends on the path alone (the stations only when there is no path), so that adding
  // a station does not move the map under the kept zoom.
  const frame = useMemo(
    () =>
      framingFeature(
        limits.map((l) => l.points),
        limits.some((l) => l.points.length > 1) ? [] : map.stations,
      ),
    [limits, map.stations],
  );

  useEffect(() => {
    const svgElement = svgRef.current;
    if (svgElement === null) return;
    const svg = select(svgElement);
    svg.selectAll('*').remove();

    const central = limits.find((l) => l.line === 'central');
    const centreLonDeg = central?.points[Math.floor(central.points.length / 2)]?.lonDeg ?? 0;
    const projection = geoNaturalEarth1().rotate([-centreLonDeg, 0]);
    const pad = 40;
    if (frame !== null)
      projection.fitExtent(
        [
          [pad, pad],
          [widthPx - pad, heightPx - pad],
        ],
        frame,
      );
    else
      projection.fitExtent(
        [
          [pad, pad],
          [widthPx - pad, heightPx - pad],
        ],
        { type: 'Sphere' },
      );
    const path = geoPath(projection);

    svg
      .append('defs')
      .append('clipPath')
      .attr('id', clipId)
      .append('rect')
      .attr('width', widthPx)
      .attr('height', heightPx);
    const root = svg.append('g').attr('clip-path', `url(#${clipId})`);
    const layer = root.append('g').attr('class', 'zoom-layer');
    const overlay = root.append('g').attr('class', 'overlay');

    const draw = (
      cls: string,
      d: string | null,
      style: { fill?: string; stroke?: string; width?: number; opacity?: number; dash?: string },
    ) =>
      layer
        .append('path')
        .attr('class', cls)
        .attr('d', d ?? '')
        .attr('fill', style.fill ?? 'none')
        .attr('fill-opacity', style.opacity ?? null)
        .attr('stroke', style.stroke ?? 'none')
        .attr('stroke-width', style.width ?? null)
        .attr('stroke-dasharray', style.dash ?? null)
        .attr('vector-effect', 'non-scaling-stroke');

    draw('sphere', path({ type: 'Sphere' }), { fill: mapPalette.ocean });
    draw('graticule', path(geoGraticule10()), { stroke: mapPalette.graticule, width: 0.5 });
    if (atlas !== null) {
      draw('land', path(atlas.land), { fill: mapPalette.land });
      draw('borders', path(atlas.borders), { stroke: mapPalette.border, width: 0.5 });
    }
    draw('night', path(nightCap(map.subsolarPoint)), { fill: mapPalette.night, opacity: 0.18 });
    draw('night-dark', path(nightCap(map.subsolarPoint, DARK_SUN_BELOW_DEG)), {
      fill: mapPalette.night,
      opacity: 0.14,
    });
    draw('sphere-outline', path({ type: 'Sphere' }), { stroke: mapPalette.tick, width: 1 });

    // Bands: each side's (and each ring's) region between R − kσ and R + kσ, the wider 3σ under the 1σ.
    for (const sigma of [3, 1] as const) {
      for (const inner of map.lines.filter((l) => l.sigma === sigma && l.edge === 'inner')) {
        const outer = map.lines.find(
          (l) => l.sigma === sigma && l.edge === 'outer' && l.line === inner.line && l.ring === inner.ring,
        );
        if (outer === undefined) continue;
        for (const polygon of bandPolygons(inner.points, outer.points))
          draw(`band band-${sigma}sigma`, path(polygon), {
            fill: inner.ring === null ? mapPalette.band : mapPalette.ring,
            opacity: sigma === 1 ? 0.45 : 0.2,
          })
            .attr('data-band', `${sigma}sigma`)
            .attr('data-side', inner.line);
      }
    }

    for (const line of [...limits].sort((a, b) => (a.ring === null ? 1 : 0) - (b.ring === null ? 1 : 0))) {
      const element = draw(`path-line path-line-${line.line}`, path(lineFeature(line.points)), {
        stroke:
          line.ring !== null
            ? mapPalette.ring
            : line.line === 'central'
              ? mapPalette.central
              : mapPalette.limit,
        width: line.line === 'central' ? 2 : 1.5,
        dash: line.ring !== null ? '8 3 2 3' : undefined,
      }).attr('data-path-line', line.line);
      if (line.ring !== null) element.attr('data-ring', line.ring);
    }

    // Ticks and stations keep their size while the map zooms: placed by the transform, not scaled by it.
    const tickData = map.ticks
      .map((t) => ({ tick: t, xy: projection([t.lonDeg, t.latDeg]) }))
      .filter((t): t is { tick: (typeof map.ticks)[number]; xy: [number, number] } => t.xy !== null);
    const ticks = overlay
      .selectAll('g.tick')
      .data(tickData)
      .join('g')
      .attr('class', 'tick')
      .attr('data-time', (d) => d.tick.timeUtc);
    ticks.append('circle').attr('r', 3).attr('fill', '#ffffff').attr('stroke', mapPalette.central);
    ticks
      .append('text')
      .attr('x', 6)
      .attr('y', -6)
      .attr('font-size', 11)
      .attr('fill', mapPalette.tick)
      .attr('paint-order', 'stroke')
      .attr('stroke', '#ffffff')
      .attr('stroke-width', 3)
      .text((d) => d.tick.label);

    const stationData = map.stations
      .map((s) => ({ station: s, xy: projection([s.lonDeg, s.latDeg]) }))
      .filter((s): s is { station: (typeof map.stations)[number]; xy: [number, number] } => s.xy !== null);
    const markers = overlay
      .selectAll('g.station')
      .data(stationData)
      .join('g')
      .attr('class', 'station')
      .attr('data-station', (d) => d.station.code)
      .attr('data-outlook', (d) => d.station.outlook)
      .attr('data-status', (d) => d.station.status);
    markers
      .append('path')
      .attr('d', (d) => outlookSymbolPath(d.station.outlook))
      .attr('fill', (d) => outlookLook[d.station.outlook].fill)
      .attr('stroke', (d) => outlookLook[d.station.outlook].stroke)
      .attr('stroke-width', (d) => outlookLook[d.station.outlook].strokeWidth)
      .attr('stroke-dasharray', (d) => statusDash[d.station.status]);
    markers
      .append('text')
      .attr('x', 8)
      .attr('y', 4)
      .attr('font-size', 11)
      .attr('paint-order', 'stroke')
      .attr('stroke', '#ffffff')
      .attr('stroke-width', 3)
      .text((d) =>
        d.station.status === 'observing' ? d.station.code : `${d.station.code} (${d.station.status})`,
      );
    markers
      .append('title')
      .text((d) => `${d.station.code}: ${d.station.outlook.replace('-', ' ')}, ${d.station.status}`);

    const place = (t: ZoomTransform) => {
      layer.attr('transform', t.toString());
      ticks.attr('transform', (d) => `translate(${t.apply(d.xy).join(',')})`);
      markers.attr('transform', (d) => `translate(${t.apply(d.xy).join(',')})`);
    };
    const behaviour = zoom<SVGSVGElement, unknown>()
      .extent([
        [0, 0],
        [widthPx, heightPx],
      ])
      .scaleExtent([0.1, 200])
      .on('zoom', (event: { transform: ZoomTransform }) => {
        transformRef.current = event.transform;
        place(event.transform);
      });
    svg.call(behaviour);
    svg.call(behaviour.transform, transformRef.current);
    zoomRef.current = behaviour;

    return () => {
      svg.on('.zoom', null);
      svg.selectAll('*').remove();
      zoomRef.current = null;
    };
  }, [map, limits, frame, atlas, widthPx, heightPx, clipId]);

  const act = (how: (b: ZoomBehavior<SVGSVGElement, unknown>, s: SVGSVGElement) => void) => {
    const svgElement = svgRef.current;
    if (svgElement !== null && zoomRef.current !== null) how(zoomRef.current, svgElement);
  };
  const zoomBy = (factor: number) => act((b, s) => select(s).call(b.scaleBy, factor));
  const pan = (dx: number, dy: number) =>
    act((b, s) => select(s).call(b.translateBy, dx / transformRef.current.k, dy / transformRef.current.k));

  return (
    <figure className={styles.figure}>
      <div className={styles.controls} role="group" aria-label="Map view">
        <Button size="small" onClick={() => zoomBy(1.5)}>
          Zoom in
        </Button>
        <Button size="small" onClick={() => zoomBy(1 / 1.5)}>
          Zoom out
        </Button>
        <Button size="small" onClick={() => act((b, s) => select(s).call(b.transform, zoomIdentity))}>
          Reset view
        </Button>
        <Button size="small" onClick={() => pan(PAN_PX, 0)}>
          Pan west
        </Button>
        <Button size="small" onClick={() => pan(-PAN_PX, 0)}>
          Pan east
        </Button>
        <Button size="small" onClick={() => pan(0, PAN_PX)}>
          Pan north
        </Button>
        <Button size="small" onClick={() => pan(0, -PAN_PX)}>
          Pan south
        </Button>
      </div>
      <svg
        ref={svgRef}
        className={styles.svg}
        role="img"
        aria-label={label}
        width={widthPx}
        height={heightPx}
        viewBox={`0 0 ${widthPx} ${heightPx}`}
      />
      {atlasError !== null ? (
        <span role="alert">The coastlines could not be loaded: {atlasError}</span>
      ) : null}
      <MapLegend map={map} />
      {map.cautions.length > 0 ? (
        <ul className={styles.cautions} aria-label="About this map">
          {map.cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      ) : null}
    </figure>
  );
}
