import { Button, makeStyles, tokens } from '@fluentui/react-components';
import type { ChordInput, SkyPointKm, Solution, SolutionChord } from '@limbus/geometry';
import {
  axisBottom,
  axisLeft,
  line,
  scaleLinear,
  select,
  zoom,
  zoomIdentity,
  type ScaleLinear,
  type ZoomBehavior,
} from 'd3';
import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { plotPalette } from '../palette';
import {
  bandEnvelope,
  chordDirection,
  errorBarKm,
  niceScaleLengthKm,
  outlineKm,
  ringEllipse,
} from '../sky-geometry';
import { SkyPlaneLegend } from './sky-plane-legend';
import { formatValueSigma } from '@/lib/value-sigma';

export interface SkyPlanePlotProps {
  solution: Solution;
  /** The event's chords, for the times shown in tooltips; the solution itself carries positions only. */
  chordInputs?: ChordInput[];
  /** Sky view (east to the left when north is up) unless false, which mirrors the f axis. */
  eastLeft?: boolean;
  widthPx?: number;
  heightPx?: number;
}

interface Tip {
  station: string;
  lines: string[];
  xPx: number;
  yPx: number;
}

type Scale = ScaleLinear<number, number>;

const MARGIN = { top: 28, right: 16, bottom: 48, left: 60 };
const OUTLINE_POINTS = 360;
const BAND_DIRECTIONS = 180;

const useStyles = makeStyles({
  wrap: { position: 'relative', display: 'inline-block', maxWidth: '100%' },
  svg: {
    display: 'block',
    maxWidth: '100%',
    height: 'auto',
    backgroundColor: '#ffffff',
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    cursor: 'grab',
    '& [data-chord]:focus': { outline: 'none' },
    '& [data-chord]:focus-visible .chord-hit': { stroke: tokens.colorStrokeFocus2, strokeOpacity: 0.6 },
  },
  controls: { display: 'flex', gap: tokens.spacingHorizontalS, marginBottom: tokens.spacingVerticalS },
  tip: {
    position: 'absolute',
    pointerEvents: 'none',
    backgroundColor: tokens.colorNeutralBackground1,
    border: `1px solid ${tokens.colorNeutralStroke1}`,
    borderRadius: tokens.borderRadiusMedium,
    boxShadow: tokens.shadow8,
    padding: `${tokens.spacingVerticalXS} ${tokens.spacingHorizontalS}`,
    fontSize: tokens.fontSizeBase200,
    whiteSpace: 'nowrap',
    transform: 'translate(12px, -50%)',
  },
});

function formatKm(valueKm: number): string {
  return `${valueKm >= 0 ? '+' : '−'}${Math.abs(valueKm).toFixed(2)} km`;
}

function timeOf(iso: string): string {
  // Observers compare timings to the millisecond in UTC; the date is the event's, shown elsewhere.
  return iso.replace(/^.*T/, '').replace(/Z$/, ' UTC');
}

function tipLines(
  chord: SolutionChord,
  input: ChordInput | undefined,
  residuals: Map<string, number>,
): string[] {
  const lines = [chord.type === 'positive' ? 'Positive chord' : 'Negative chord'];
  if (input?.type === 'positive') {
    for (const [edge, mark] of [
      ['Disappearance', input.disappearance],
      ['Reappearance', input.reappearance],
    ] as const)
      lines.push(
        mark === undefined
          ? `${edge} not observed (single-edge chord)`
          : `${edge} ${timeOf(mark.time)} ± ${mark.sigmaSeconds.toFixed(3)} s`,
      );
  } else if (input?.type === 'negative') {
    lines.push(`Watched ${timeOf(input.start)} – ${timeOf(input.end)}`);
  }
  for (const event of ['disappearance', 'reappearance'] as const) {
    const residual = residuals.get(`${chord.station}|${event}`);
    if (residual !== undefined) lines.push(`Residual (${event}) ${formatKm(residual)}`);
  }
  return lines;
}

/** Points the view must contain: the limb, rings, chord endpoints and crossings (not the long paths). */
function extentKm(solution: Solution): { fMin: number; fMax: number; gMin: number; gMax: number } {
  const points: SkyPointKm[] = [];
  if (solution.limb !== null) points.push(...outlineKm(solution.limb, 72));
  for (const ring of solution.rings) points.push(...outlineKm(ringEllipse(ring), 72), ...ring.crossings);
  for (const chord of solution.chords) points.push(...chord.points);
  if (points.length === 0) for (const chord of solution.chords) points.push(...chord.path);
  if (points.length === 0) points.push({ fKm: -1, gKm: -1 }, { fKm: 1, gKm: 1 });
  const fs = points.map((p) => p.fKm);
  const gs = points.map((p) => p.gKm);
  return { fMin: Math.min(...fs), fMax: Math.max(...fs), gMin: Math.min(...gs), gMax: Math.max(...gs) };
}

export function skyPlaneLabel(solution: Solution): string {
  const positive = solution.chords.filter((c) => c.type === 'positive').length;
  const negative = solution.chords.length - positive;
  const parts = [`${positive} positive and ${negative} negative chords`];
  if (solution.limb !== null) {
    parts.push(
      `fitted limb of equivalent radius ${solution.limb.equivalentRadiusKm.toFixed(1)} ± ${solution.limb.uncertainty.equivalentRadiusKm.toFixed(1)} km`,
    );
  }
  if (solution.rings.length > 0)
    parts.push(`${solution.rings.length} ring${solution.rings.length === 1 ? '' : 's'}`);
  return `Sky-plane plot: ${parts.join(', ')}`;
}

export function SkyPlanePlot({
  solution,
  chordInputs = [],
  eastLeft = true,
  widthPx = 720,
  heightPx = 560,
}: SkyPlanePlotProps) {
  const styles = useStyles();
  const svgRef = useRef<SVGSVGElement>(null);
  const zoomRef = useRef<ZoomBehavior<SVGSVGElement, unknown> | null>(null);
  const [tip, setTip] = useState<Tip | null>(null);
  const clipId = `sky-clip-${useId().replace(/[^a-zA-Z0-9_-]/g, '')}`;
  const tipId = `${clipId}-tip`;
  const label = useMemo(() => skyPlaneLabel(solution), [solution]);

  useEffect(() => {
    const svgElement = svgRef.current;
    if (svgElement === null) return;
    const svg = select(svgElement);
    svg.selectAll('*').remove();

    const plotW = widthPx - MARGIN.left - MARGIN.right;
    const plotH = heightPx - MARGIN.top - MARGIN.bottom;
    const ext = extentKm(solution);
    // Equal km per pixel on both axes, so the limb's shape on screen is its shape on the sky.
    const kmPerPx = (Math.max((ext.fMax - ext.fMin) / plotW, (ext.gMax - ext.gMin) / plotH) || 1) * 1.15;
    const fMid = (ext.fMin + ext.fMax) / 2;
    const gMid = (ext.gMin + ext.gMax) / 2;
    const halfF = (kmPerPx * plotW) / 2;
    const halfG = (kmPerPx * plotH) / 2;
    const x0 = scaleLinear()
      .domain(eastLeft ? [fMid + halfF, fMid - halfF] : [fMid - halfF, fMid + halfF])
      .range([MARGIN.left, MARGIN.left + plotW]);
    const y0 = scaleLinear()
      .domain([gMid - halfG, gMid + halfG])
      .range([MARGIN.top + plotH, MARGIN.top]);

    const residuals = new Map<string, number>();
    for (const r of solution.limb?.radialResidualsKm ?? [])
      residuals.set(`${r.station}|${r.event}`, r.residualKm);
    const inputs = new Map(chordInputs.map((c) => [c.station, c]));

    svg
      .append('defs')
      .append('clipPath')
      .attr('id', clipId)
      .append('rect')
      .attr('x', MARGIN.left)
      .attr('y', MARGIN.top)
      .attr('width', plotW)
      .attr('height', plotH);

    const xAxis = svg
      .append('g')
      .attr('class', 'axis axis-f')
      .attr('transform', `translate(0,${MARGIN.top + plotH})`);
    const yAxis = svg
      .append('g')
      .attr('class', 'axis axis-g')
      .attr('transform', `translate(${MARGIN.left},0)`);
    svg
      .append('text')
      .attr('class', 'axis-label')
      .attr('x', MARGIN.left + plotW / 2)
      .attr('y', heightPx - 10)
      .attr('text-anchor', 'middle')
      .text('f (km)');
    svg
      .append('text')
      .attr('class', 'axis-label')
      .attr('transform', `translate(16,${MARGIN.top + plotH / 2}) rotate(-90)`)
      .attr('text-anchor', 'middle')
      .text('g (km)');
    svg
      .append('text')
      .attr('class', 'orientation')
      .attr('x', MARGIN.left)
      .attr('y', 18)
      .attr('font-size', 12)
      .attr('fill', plotPalette.axis)
      .text(eastLeft ? 'North up, east left (as seen on the sky)' : 'North up, east right (mirrored)');

    const plot = svg.append('g').attr('clip-path', `url(#${clipId})`);
    const bandLayer = plot
      .append('path')
      .attr('class', 'limb-band')
      .attr('fill', plotPalette.band)
      .attr('fill-opacity', 0.35)
      .attr('fill-rule', 'evenodd')
      .attr('stroke', 'none');
    const ringLayer = plot.append('g').attr('class', 'rings');
    const limbPath = plot
      .append('path')
      .attr('class', 'limb')
      .attr('fill', 'none')
      .attr('stroke', plotPalette.limb)
      .attr('stroke-width', 1.5);
    const chordLayer = plot.append('g').attr('class', 'chords');
    const crossingLayer = plot.append('g').attr('class', 'ring-crossings');
    const centreLayer = plot
      .append('g')
      .attr('class', 'centre')
      .attr('stroke', plotPalette.centre)
      .attr('stroke-width', 2);

    const limb = solution.limb;
    const limbOutline = limb === null ? [] : outlineKm(limb, OUTLINE_POINTS);
    const band =
      limb === null || limb.band.length === 0
        ? null
        : bandEnvelope({ fKm: limb.centerFKm, gKm: limb.centerGKm }, limb.band, BAND_DIRECTIONS);
    if (band === null) bandLayer.remove();
    if (limb === null) {
      limbPath.remove();
      centreLayer.remove();
    }

    const rings = solution.rings.map((ring) => ({
      ring,
      outline: outlineKm(ringEllipse(ring), OUTLINE_POINTS),
    }));
    const ringPaths = ringLayer
      .selectAll('path')
      .data(rings)
      .join('path')
      .attr('class', 'ring')
      .attr('data-ring', (d) => d.ring.ring)
      .attr('fill', 'none')
      .attr('stroke', plotPalette.ring)
      .attr('stroke-width', 1.5)
      .attr('stroke-dasharray', '8 3 2 3');

    const crossingData = solution.rings.flatMap((ring) =>
      ring.crossings.map((c) => ({ ...c, ring: ring.ring })),
    );
    const crossingMarks = crossingLayer
      .selectAll('path')
      .data(crossingData)
      .join('path')
      .attr('class', 'ring-crossing')
      .attr('data-station', (d) => d.station)
      .attr('d', 'M0,-6L6,0L0,6L-6,0Z')
      .attr('fill', plotPalette.ringCrossing)
      .attr('stroke', '#000000')
      .attr('stroke-width', 0.75);
    crossingMarks
      .append('title')
      .text(
        (d) =>
          `Ring ${d.ring} crossing at ${d.station}, radial width ${
            d.radialWidthKmSigma === undefined
              ? d.radialWidthKm.toFixed(1)
              : formatValueSigma(d.radialWidthKm, d.radialWidthKmSigma)
          } km`,
      );

    const chordGroups = chordLayer
      .selectAll<SVGGElement, SolutionChord>('g')
      .data(solution.chords)
      .join('g')
      .attr('class', (d) => `chord chord-${d.type}`)
      .attr('data-chord', (d) => d.station)
      .attr('tabindex', 0)
      .attr('aria-describedby', tipId);

    chordGroups
      .append('path')
      .attr('class', 'chord-hit')
      .attr('fill', 'none')
      .attr('stroke', 'transparent')
      .attr('stroke-width', 12);
    chordGroups
      .append('path')
      .attr('class', 'chord-path')
      .attr('fill', 'none')
      .attr('stroke', (d) => (d.type === 'positive' ? plotPalette.positiveChord : plotPalette.negativeChord))
      .attr('stroke-width', (d) => (d.type === 'positive' ? 0.75 : 1.5))
      .attr('stroke-opacity', (d) => (d.type === 'positive' ? 0.45 : 1))
      .attr('stroke-dasharray', (d) => (d.type === 'positive' ? null : '6 4'));

    const positives = chordGroups.filter((d) => d.type === 'positive');
    // A single-edge chord is its one point: there is no segment to draw between two edges.
    positives
      .filter((d) => d.points.length >= 2)
      .append('line')
      .attr('class', 'chord-segment')
      .attr('stroke', plotPalette.positiveChord)
      .attr('stroke-width', 2.5);
    const endpoints = positives
      .selectAll('g.endpoint')
      .data((d) => d.points.map((p) => ({ point: p, direction: chordDirection(d) })))
      .join('g')
      .attr('class', 'endpoint')
      .attr('data-event', (d) => d.point.event);
    endpoints
      .append('line')
      .attr('class', 'error-bar')
      .attr('stroke', plotPalette.limb)
      .attr('stroke-width', 1.25);
    endpoints
      .append('circle')
      .attr('class', 'endpoint-marker')
      .attr('r', 3)
      .attr('fill', plotPalette.positiveChord);

    const negatives = chordGroups.filter((d) => d.type === 'negative');
    negatives
      .selectAll('circle.path-end')
      .data((d) => [d.path[0], d.path[d.path.length - 1]].filter((p): p is SkyPointKm => p !== undefined))
      .join('circle')
      .attr('class', 'path-end')
      .attr('r', 4)
      .attr('fill', '#ffffff')
      .attr('stroke', plotPalette.negativeChord)
      .attr('stroke-width', 1.5);

    const centreH = centreLayer.append('line').attr('class', 'centre-error-f');
    const centreV = centreLayer.append('line').attr('class', 'centre-error-g');
    // A fixed-size mark, because a well-measured centre's error cross can be smaller than a pixel.
    const centreMark = centreLayer
      .append('circle')
      .attr('class', 'centre-mark')
      .attr('r', 3.5)
      .attr('fill', '#ffffff');

    const compass = svg
      .append('g')
      .attr('class', 'compass')
      .attr('transform', `translate(${MARGIN.left + plotW - 40},${MARGIN.top + 44})`);
    const eastSign = eastLeft ? -1 : 1;
    compass
      .append('path')
      .attr('d', 'M0,0V-30M-4,-24L0,-30L4,-24')
      .attr('stroke', plotPalette.axis)
      .attr('fill', 'none')
      .attr('stroke-width', 1.5);
    compass
      .append('path')
      .attr('d', `M0,0H${30 * eastSign}M${24 * eastSign},-4L${30 * eastSign},0L${24 * eastSign},4`)
      .attr('stroke', plotPalette.axis)
      .attr('fill', 'none')
      .attr('stroke-width', 1.5);
    compass
      .append('text')
      .attr('x', 0)
      .attr('y', -34)
      .attr('text-anchor', 'middle')
      .attr('font-size', 12)
      .text('N');
    compass
      .append('text')
      .attr('x', 38 * eastSign)
      .attr('y', 4)
      .attr('text-anchor', 'middle')
      .attr('font-size', 12)
      .text('E');

    const scaleBar = svg
      .append('g')
      .attr('class', 'scale-bar')
      .attr('transform', `translate(${MARGIN.left + 16},${MARGIN.top + plotH - 16})`);
    const scaleLine = scaleBar
      .append('path')
      .attr('stroke', plotPalette.axis)
      .attr('stroke-width', 2)
      .attr('fill', 'none');
    const scaleText = scaleBar.append('text').attr('y', -6).attr('font-size', 12);

    let current = { x: x0, y: y0 };

    const draw = (x: Scale, y: Scale) => {
      current = { x, y };
      const toPath = line<SkyPointKm>()
        .x((p) => x(p.fKm))
        .y((p) => y(p.gKm));
      const closed = (points: SkyPointKm[]) => (points.length === 0 ? '' : `${toPath(points) ?? ''}Z`);
      xAxis.call(axisBottom(x).ticks(8));
      yAxis.call(axisLeft(y).ticks(8));
      if (band !== null) bandLayer.attr('d', `${closed(band.outerKm)}${closed(band.innerKm)}`);
      if (limb !== null) {
        limbPath.attr('d', closed(limbOutline));
        const { centerFKm: f, centerGKm: g } = limb;
        const { centerFKm: sf, centerGKm: sg } = limb.uncertainty;
        centreH
          .attr('x1', x(f - sf))
          .attr('x2', x(f + sf))
          .attr('y1', y(g))
          .attr('y2', y(g));
        centreV
          .attr('x1', x(f))
          .attr('x2', x(f))
          .attr('y1', y(g - sg))
          .attr('y2', y(g + sg));
        centreMark.attr('cx', x(f)).attr('cy', y(g));
      }
      ringPaths.attr('d', (d) => closed(d.outline));
      crossingMarks.attr('transform', (d) => `translate(${x(d.fKm)},${y(d.gKm)})`);
      chordGroups.select<SVGPathElement>('.chord-hit').attr('d', (d) => toPath(d.path) ?? '');
      chordGroups.select<SVGPathElement>('.chord-path').attr('d', (d) => toPath(d.path) ?? '');
      positives
        .select<SVGLineElement>('.chord-segment')
        .attr('x1', (d) => x(d.points[0]?.fKm ?? 0))
        .attr('y1', (d) => y(d.points[0]?.gKm ?? 0))
        .attr('x2', (d) => x(d.points[1]?.fKm ?? d.points[0]?.fKm ?? 0))
        .attr('y2', (d) => y(d.points[1]?.gKm ?? d.points[0]?.gKm ?? 0));
      endpoints.select<SVGLineElement>('.error-bar').each(function (d) {
        const [a, b] = errorBarKm(d.point, d.direction, d.point.sigmaKm);
        select(this).attr('x1', x(a.fKm)).attr('y1', y(a.gKm)).attr('x2', x(b.fKm)).attr('y2', y(b.gKm));
      });
      endpoints
        .select<SVGCircleElement>('.endpoint-marker')
        .attr('cx', (d) => x(d.point.fKm))
        .attr('cy', (d) => y(d.point.gKm));
      negatives
        .selectAll<SVGCircleElement, SkyPointKm>('circle.path-end')
        .attr('cx', (p) => x(p.fKm))
        .attr('cy', (p) => y(p.gKm));
      const kmPerPxNow = Math.abs(x.invert(1) - x.invert(0));
      const barKm = niceScaleLengthKm(kmPerPxNow * plotW);
      const barPx = barKm / kmPerPxNow;
      scaleLine.attr('d', `M0,-4V0H${barPx}V-4`);
      scaleText.text(`${barKm} km`);
    };

    const show = (chord: SolutionChord, xPx: number, yPx: number) =>
      setTip({
        station: chord.station,
        lines: tipLines(chord, inputs.get(chord.station), residuals),
        xPx,
        yPx,
      });
    chordGroups
      .on('mousemove', function (event: MouseEvent, d) {
        const box = svgElement.getBoundingClientRect();
        const sx = box.width > 0 ? widthPx / box.width : 1;
        show(d, (event.clientX - box.left) * sx, (event.clientY - box.top) * sx);
      })
      .on('focus', (_event: FocusEvent, d) => {
        const a = d.points[0] ?? d.path[0];
        const b = d.points[1] ?? d.path[d.path.length - 1] ?? a;
        if (a === undefined || b === undefined) return;
        const fKm = (a.fKm + b.fKm) / 2;
        const gKm = (a.gKm + b.gKm) / 2;
        const xPx = Math.min(Math.max(current.x(fKm), MARGIN.left), MARGIN.left + plotW);
        const yPx = Math.min(Math.max(current.y(gKm), MARGIN.top), MARGIN.top + plotH);
        show(d, xPx, yPx);
      })
      .on('mouseleave blur', () => setTip(null));

    const zoomBehavior = zoom<SVGSVGElement, unknown>()
      .extent([
        [MARGIN.left, MARGIN.top],
        [MARGIN.left + plotW, MARGIN.top + plotH],
      ])
      .scaleExtent([0.5, 64])
      .on('zoom', (event: { transform: typeof zoomIdentity }) => {
        draw(event.transform.rescaleX(x0), event.transform.rescaleY(y0));
      });
    svg.call(zoomBehavior);
    zoomRef.current = zoomBehavior;
    draw(x0, y0);

    return () => {
      svg.on('.zoom', null);
      svg.selectAll('*').remove();
      zoomRef.current = null;
    };
  }, [solution, chordInputs, eastLeft, widthPx, heightPx, clipId, tipId]);

  const zoomBy = (factor: number) => {
    const svgElement = svgRef.current;
    if (svgElement !== null && zoomRef.current !== null)
      select(svgElement).call(zoomRef.current.scaleBy, factor);
  };
  const resetView = () => {
    const svgElement = svgRef.current;
    if (svgElement !== null && zoomRef.current !== null)
      select(svgElement).call(zoomRef.current.transform, zoomIdentity);
  };

  return (
    <figure style={{ margin: 0 }}>
      <div className={styles.controls} role="group" aria-label="Sky-plane view">
        <Button size="small" onClick={() => zoomBy(1.5)}>
          Zoom in
        </Button>
        <Button size="small" onClick={() => zoomBy(1 / 1.5)}>
          Zoom out
        </Button>
        <Button size="small" onClick={resetView}>
          Reset view
        </Button>
      </div>
      <div className={styles.wrap}>
        <svg
          ref={svgRef}
          className={styles.svg}
          role="img"
          aria-label={label}
          width={widthPx}
          height={heightPx}
          viewBox={`0 0 ${widthPx} ${heightPx}`}
        />
        <div
          id={tipId}
          role="status"
          aria-live="polite"
          className={styles.tip}
          style={tip === null ? { display: 'none' } : { left: tip.xPx, top: tip.yPx }}
        >
          {tip === null ? null : (
            <>
              <strong>{tip.station}</strong>
              {tip.lines.map((text) => (
                <div key={text}>{text}</div>
              ))}
            </>
          )}
        </div>
      </div>
      <SkyPlaneLegend
        hasBand={solution.limb !== null && solution.limb.band.length > 0}
        hasRings={solution.rings.length > 0}
      />
    </figure>
  );
}
