import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import { describe, expect, it } from 'vitest';
import { testMap } from '../testing/test-map';
import { ShadowPathMap } from './shadow-path-map';
import { renderWithProviders } from '@/testing/test-utils';

const zoomLayer = (svg: Element) => svg.querySelector('g.zoom-layer')?.getAttribute('transform') ?? '';
const markerAt = (svg: Element, code: string) =>
  svg.querySelector(`[data-station="${code}"]`)?.getAttribute('transform') ?? '';

/** The map with a button that adds a station, as a refetch after "Make a planned station" would. */
function MapWithNewStation() {
  const [map, setMap] = useState(testMap);
  const add = () =>
    setMap((old) => ({
      ...old,
      stations: [
        ...old.stations,
        {
          stationId: 's6',
          code: 'planned-1',
          status: 'planned',
          latDeg: 10.5,
          lonDeg: 63,
          outlook: 'inside',
        },
      ],
    }));
  return (
    <>
      <button onClick={add}>Add a station</button>
      <ShadowPathMap map={map} />
    </>
  );
}

describe('ShadowPathMap', () => {
  it('ShadowPathMap draws its named map with the path lines, ring lines, bands and a marker per station', async () => {
    renderWithProviders(<ShadowPathMap map={testMap()} />);
    const svg = screen.getByRole('img', { name: /^Shadow path map / });
    expect(svg.getAttribute('aria-label')).toContain('1σ = 20.0 km');
    expect(svg.getAttribute('aria-label')).toContain('5 stations');
    const kinds = [...svg.querySelectorAll('[data-path-line]')].map(
      (e) => `${e.getAttribute('data-path-line')}${e.getAttribute('data-ring') ?? ''}`,
    );
    expect(kinds.sort()).toEqual(['central', 'left', 'leftR1', 'right', 'rightR1']);
    for (const line of svg.querySelectorAll('[data-path-line]')) expect(line.getAttribute('d')).toMatch(/^M/);
    // One band per side and σ, none filling the rest of the globe.
    expect(svg.querySelectorAll('[data-band="1sigma"]')).toHaveLength(2);
    expect(svg.querySelectorAll('[data-band="3sigma"]')).toHaveLength(2);
    for (const code of ['amberfield', 'brackenhill', 'cindervale', 'dunmarsh', 'eastwick'])
      expect(svg.querySelector(`[data-station="${code}"]`)).not.toBeNull();
    expect(svg.querySelector('[data-station="brackenhill"]')?.getAttribute('data-outlook')).toBe('ring-only');
    expect(svg.querySelector('[data-station="cindervale"] text')?.textContent).toBe('cindervale (proposed)');
    expect(svg.querySelectorAll('g.tick')).toHaveLength(2);
    // The Earth comes from the shipped atlas, without a request.
    await waitFor(() => expect(svg.querySelector('path.land')?.getAttribute('d')).toMatch(/^M/), {
      timeout: 20_000,
    });
    const legend = screen.getByRole('list', { name: 'Map legend' });
    expect(legend).toHaveTextContent('Outside the body, inside a ring');
    expect(legend).toHaveTextContent('1σ band of each limit (± 20.0 km)');
    expect(screen.getByRole('list', { name: 'About this map' })).toHaveTextContent(
      'A prediction has an uncertainty',
    );
  });

  it('ShadowPathMap zooms and pans with its buttons, and keeps the view when the data change', async () => {
    const user = userEvent.setup();
    renderWithProviders(<MapWithNewStation />);
    const svg = screen.getByRole('img', { name: /^Shadow path map / });
    const start = zoomLayer(svg);
    const markerStart = markerAt(svg, 'amberfield');
    await user.click(screen.getByRole('button', { name: 'Zoom in' }));
    const zoomed = zoomLayer(svg);
    expect(zoomed).toMatch(/scale\(1\.5\)/);
    // A marker keeps its size but moves with the map.
    expect(markerAt(svg, 'amberfield')).not.toBe(markerStart);
    await user.click(screen.getByRole('button', { name: 'Pan east' }));
    expect(zoomLayer(svg)).not.toBe(zoomed);
    const chosen = zoomLayer(svg);

    await user.click(screen.getByRole('button', { name: 'Add a station' }));
    const again = screen.getByRole('img', { name: /^Shadow path map / });
    expect(again.querySelector('[data-station="planned-1"]')).not.toBeNull();
    expect(zoomLayer(again)).toBe(chosen);

    await user.click(screen.getByRole('button', { name: 'Reset view' }));
    expect(zoomLayer(again)).toBe(start);
  });
});
