import { Button, makeStyles, tokens, Toolbar } from '@fluentui/react-components';
import { axisBottom, axisLeft, line, scaleLinear, select } from 'd3';
import { useEffect, useMemo, useRef, useState } from 'react';
import {
  type Domain,
  fullDomain,
  type LightCurveFigure,
  panDomain,
  secondsAfter,
  windowAround,
  zoomDomain,
} from './light-curve-geometry';

export interface LightCurvePlotProps {
  /** A timing's result, or a raw curve (no model) with the times to mark on it. */
  result: LightCurveFigure;
  stationLabel: string;
  widthPx?: number;
}

const MARGIN = { top: 16, right: 16, bottom: 48, left: 64 };
const FLUX_HEIGHT_PX = 260;
const RESIDUAL_HEIGHT_PX = 110;
const GAP_PX = 40;
const COLOURS = { data: '#3b5b92', model: '#c2410c', edge: '#15803d', dip: '#a855f7', marked: '#db2777' };

const useStyles = makeStyles({
  svg: {
    display: 'block',
    maxWidth: '100%',
    height: 'auto',
    backgroundColor: '#ffffff',
    border: `1px solid ${tokens.colorNeutralStroke2}`,
  },
});

function timeOfDay(iso: string): string {
  return iso.slice(11, 19);
}

/**
 * The light curve as fitted: samples, the model, residuals below, D and R with their 1-sigma span, and
 * the dips shaded. A raw curve (no model) is drawn without the model line and the residual panel. Zoom
 * and pan are buttons, so a keyboard reaches them; D3 draws, React holds the window.
 */
export function LightCurvePlot({ result, stationLabel, widthPx = 760 }: LightCurvePlotProps) {
  const styles = useStyles();
  const svgRef = useRef<SVGSVGElement>(null);
  const full = useMemo(() => fullDomain(result), [result]);
  const [domain, setDomain] = useState<Domain>(full);
  useEffect(() => setDomain(full), [full]);
  const origin = result.series.originUtc;
  const edges = useMemo(
    () =>
      [
        { key: 'disappearance', label: 'D', mark: result.disappearance },
        { key: 'reappearance', label: 'R', mark: result.reappearance },
      ].flatMap((e) =>
        e.mark === null
          ? []
          : [{ ...e, seconds: secondsAfter(origin, e.mark.time), sigmaSeconds: e.mark.sigmaSeconds }],
      ),
    [result, origin],
  );
  const fitted = result.series.modelFlux !== null;
  const heightPx = fitted
    ? MARGIN.top + FLUX_HEIGHT_PX + GAP_PX + RESIDUAL_HEIGHT_PX + MARGIN.bottom
    : MARGIN.top + FLUX_HEIGHT_PX + MARGIN.bottom;

  useEffect(() => {
    const svgElement = svgRef.current;
    if (svgElement === null) return;
    const svg = select(svgElement);
    svg.selectAll('*').remove();
    const { timesSeconds, flux, modelFlux } = result.series;
    const visible = timesSeconds
      .map((t, i) => ({ t, f: flux[i] ?? 0, m: modelFlux?.[i] ?? null }))
      .filter((p) => p.t >= domain.fromSeconds && p.t <= domain.toSeconds);
    const innerWidth = widthPx - MARGIN.left - MARGIN.right;
    const x = scaleLinear().domain([domain.fromSeconds, domain.toSeconds]).range([0, innerWidth]);
    const fluxValues = visible.flatMap((p) => (p.m === null ? [p.f] : [p.f, p.m]));
    const y = scaleLinear()
      .domain([Math.min(0, ...fluxValues), Math.max(1, ...fluxValues)])
      .nice()
      .range([FLUX_HEIGHT_PX, 0]);

    svg
      .append('defs')
      .append('clipPath')
      .attr('id', 'light-curve-clip')
      .append('rect')
      .attr('width', innerWidth)
      .attr('height', FLUX_HEIGHT_PX);
    const top = svg.append('g').attr('transform', `translate(${MARGIN.left},${MARGIN.top})`);
    const plot = top.append('g').attr('clip-path', 'url(#light-curve-clip)');

    for (const [k, dip] of result.dips.entries()) {
      const from = x(secondsAfter(origin, dip.start.time));
      const to = x(secondsAfter(origin, dip.end.time));
      plot
        .append('rect')
        .attr('class', 'dip')
        .attr('data-dip', k)
        .attr('data-marked', String(dip.marked))
        .attr('x', Math.min(from, to))
        .attr('width', Math.max(1, Math.abs(to - from)))
        .attr('y', 0)
        .attr('height', FLUX_HEIGHT_PX)
        .attr('fill', dip.marked ? COLOURS.marked : COLOURS.dip)
        .attr('fill-opacity', 0.18);
    }
    for (const edge of edges) {
      const g = plot.append('g').attr('class', 'edge').attr('data-edge', edge.key);
      g.append('rect')
        .attr('class', 'edge-error')
        .attr('x', x(edge.seconds - edge.sigmaSeconds))
        .attr('width', Math.max(1, x(edge.seconds + edge.sigmaSeconds) - x(edge.seconds - edge.sigmaSeconds)))
        .attr('y', 0)
        .attr('height', FLUX_HEIGHT_PX)
        .attr('fill', COLOURS.edge)
        .attr('fill-opacity', 0.2);
      g.append('line')
        .attr('x1', x(edge.seconds))
        .attr('x2', x(edge.seconds))
        .attr('y1', 0)
        .attr('y2', FLUX_HEIGHT_PX)
        .attr('stroke', COLOURS.edge)
        .attr('stroke-width', 1.5);
      g.append('text')
        .attr('x', x(edge.seconds) + 4)
        .attr('y', 12)
        .attr('font-size', 12)
        .attr('fill', COLOURS.edge)
        .text(edge.label);
    }
    plot
      .selectAll('circle.sample')
      .data(visible)
      .join('circle')
      .attr('class', 'sample')
      .attr('cx', (p) => x(p.t))
      .attr('cy', (p) => y(p.f))
      .attr('r', 1.8)
      .attr('fill', COLOURS.data);
    const modelled = visible.flatMap((p) => (p.m === null ? [] : [{ t: p.t, f: p.f, m: p.m }]));
    const timeAxisLabel = `Time (s after ${timeOfDay(origin)} UTC)`;

    top.append('g').attr('transform', `translate(0,${FLUX_HEIGHT_PX})`).call(axisBottom(x).ticks(8));
    top.append('g').call(axisLeft(y).ticks(6));
    top
      .append('text')
      .attr('transform', 'rotate(-90)')
      .attr('x', -FLUX_HEIGHT_PX / 2)
      .attr('y', -46)
      .attr('text-anchor', 'middle')
      .attr('font-size', 12)
      .text(fitted ? 'Normalised flux' : 'Flux (as recorded)');
    if (!fitted) {
      top
        .append('text')
        .attr('x', innerWidth / 2)
        .attr('y', FLUX_HEIGHT_PX + 38)
        .attr('text-anchor', 'middle')
        .attr('font-size', 12)
        .text(timeAxisLabel);
      return;
    }
    plot
      .append('path')
      .attr('class', 'model')
      .attr('fill', 'none')
      .attr('stroke', COLOURS.model)
      .attr('stroke-width', 1.5)
      .attr(
        'd',
        line<{ t: number; m: number }>()
          .x((p) => x(p.t))
          .y((p) => y(p.m))(modelled) ?? '',
      );
    const residualLimit = Math.max(1e-6, ...modelled.map((p) => Math.abs(p.f - p.m)));
    const yr = scaleLinear().domain([-residualLimit, residualLimit]).nice().range([RESIDUAL_HEIGHT_PX, 0]);

    const bottom = svg
      .append('g')
      .attr('transform', `translate(${MARGIN.left},${MARGIN.top + FLUX_HEIGHT_PX + GAP_PX})`);
    bottom
      .append('line')
      .attr('class', 'zero')
      .attr('x1', 0)
      .attr('x2', innerWidth)
      .attr('y1', yr(0))
      .attr('y2', yr(0))
      .attr('stroke', tokens.colorNeutralStroke1);
    bottom
      .selectAll('circle.residual')
      .data(modelled)
      .join('circle')
      .attr('class', 'residual')
      .attr('cx', (p) => x(p.t))
      .attr('cy', (p) => yr(p.f - p.m))
      .attr('r', 1.5)
      .attr('fill', COLOURS.data);
    bottom.append('g').attr('transform', `translate(0,${RESIDUAL_HEIGHT_PX})`).call(axisBottom(x).ticks(8));
    bottom.append('g').call(axisLeft(yr).ticks(3));
    bottom
      .append('text')
      .attr('transform', 'rotate(-90)')
      .attr('x', -RESIDUAL_HEIGHT_PX / 2)
      .attr('y', -46)
      .attr('text-anchor', 'middle')
      .attr('font-size', 12)
      .text('Residual (flux)');
    bottom
      .append('text')
      .attr('x', innerWidth / 2)
      .attr('y', RESIDUAL_HEIGHT_PX + 38)
      .attr('text-anchor', 'middle')
      .attr('font-size', 12)
      .text(timeAxisLabel);
  }, [result, domain, edges, origin, widthPx, fitted]);

  const label =
    `Light curve of ${stationLabel}: ${result.series.timesSeconds.length} samples, ` +
    edges.map((e) => `${e.key} at ${e.mark?.time} ± ${e.sigmaSeconds.toFixed(3)} s`).join(', ') +
    `${edges.length > 0 ? ', ' : ''}${result.dips.length} dip${result.dips.length === 1 ? '' : 's'}`;

  return (
    <div>
      <Toolbar aria-label="Light-curve zoom">
        <Button onClick={() => setDomain((d) => zoomDomain(d, 0.5, full))}>Zoom in</Button>
        <Button onClick={() => setDomain((d) => zoomDomain(d, 2, full))}>Zoom out</Button>
        <Button onClick={() => setDomain((d) => panDomain(d, -0.25, full))}>Pan earlier</Button>
        <Button onClick={() => setDomain((d) => panDomain(d, 0.25, full))}>Pan later</Button>
        {edges.map((e) => (
          <Button key={e.key} onClick={() => setDomain(windowAround(e.seconds, 2, full))}>
            Zoom to {e.label}
          </Button>
        ))}
        <Button onClick={() => setDomain(full)}>Show all</Button>
      </Toolbar>
      <svg
        ref={svgRef}
        role="img"
        aria-label={label}
        className={styles.svg}
        viewBox={`0 0 ${widthPx} ${heightPx}`}
        width={widthPx}
        height={heightPx}
        data-from-seconds={domain.fromSeconds}
        data-to-seconds={domain.toSeconds}
      />
    </div>
  );
}
