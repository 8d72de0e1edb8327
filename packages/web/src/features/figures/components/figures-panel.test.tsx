import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { Solution } from '@limbus/geometry';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { FiguresPanel } from './figures-panel';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

// The panel passes the solution through as JSON only; its contents do not matter here.
const TEST_SOLUTION = { format: 'limbus-solution/1' } as unknown as Solution;

// jsdom has no object URLs; the anchor's click is recorded instead of a download.
const saved: Array<{ name: string; size: number }> = [];
beforeEach(() => {
  saved.length = 0;
  const blobs = new Map<string, Blob>();
  vi.stubGlobal(
    'URL',
    Object.assign(URL, {
      createObjectURL: (blob: Blob) => {
        const url = `blob:test/${blobs.size}`;
        blobs.set(url, blob);
        return url;
      },
      revokeObjectURL: () => undefined,
    }),
  );
  vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
    saved.push({ name: this.download, size: blobs.get(this.href)?.size ?? -1 });
  });
});
afterEach(() => {
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

describe('FiguresPanel', () => {
  it("FiguresPanel downloads the server's figure and table of the shown fit under names that say what they are", async () => {
    const calls = stubFetch((call) => {
      if (call.url.startsWith('/api/fits/f1/figure?'))
        return new Response('%PDF-1.7 figure', {
          status: 200,
          headers: { 'Content-Type': 'application/pdf' },
        });
      if (call.url === '/api/fits/f1/table?format=tex')
        return new Response('\\begin{tabular}', {
          status: 200,
          headers: { 'Content-Type': 'application/x-tex' },
        });
      return jsonResponse(404, { message: 'unexpected' });
    });
    const user = userEvent.setup();
    renderWithProviders(
      <FiguresPanel fitId="f1" solution={TEST_SOLUTION} inputMatchesEvent fileStem="night-one" />,
    );
    await user.click(screen.getByRole('button', { name: 'Download fit figure' }));
    await vi.waitFor(() => expect(saved).toHaveLength(1));
    expect(calls[0]?.url).toBe('/api/fits/f1/figure?format=pdf&widthMm=180');
    expect(saved[0]).toEqual({ name: 'night-one-sky-plane-180mm.pdf', size: 15 });

    await user.selectOptions(screen.getByRole('combobox', { name: 'Figure format' }), 'PNG, 600 dpi');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Figure width' }), 'Single column, 88 mm');
    await user.click(screen.getByRole('button', { name: 'Download fit figure' }));
    await vi.waitFor(() => expect(calls).toHaveLength(2));
    expect(calls[1]?.url).toBe('/api/fits/f1/figure?format=png&widthMm=88&dpi=600');

    await user.click(screen.getByRole('button', { name: 'Download fit table as LaTeX' }));
    await vi.waitFor(() => expect(saved.map((s) => s.name)).toContain('night-one-parameters.tex'));
    expect(screen.queryByText('Based on older data')).not.toBeInTheDocument();
  });

  it('FiguresPanel warns before any download that the fit ran on older data than the event holds now', () => {
    stubFetch(() => jsonResponse(404, { message: 'unexpected' }));
    renderWithProviders(
      <FiguresPanel fitId="f1" solution={TEST_SOLUTION} inputMatchesEvent={false} fileStem="night-one" />,
    );
    const panel = screen.getByRole('region', { name: 'Figures' });
    expect(within(panel).getByText('Based on older data')).toBeInTheDocument();
    expect(within(panel).getByText(/Run the fit again before relying on it/)).toBeInTheDocument();
    expect(within(panel).getByRole('button', { name: 'Download fit figure' })).toBeInTheDocument();
  });

  it('FiguresPanel says what failed when the server refuses a figure', async () => {
    stubFetch(() => jsonResponse(500, { statusCode: 500, message: 'the renderer stopped' }));
    const user = userEvent.setup();
    renderWithProviders(
      <FiguresPanel fitId="f1" solution={TEST_SOLUTION} inputMatchesEvent fileStem="night-one" />,
    );
    await user.click(screen.getByRole('button', { name: 'Download fit figure' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('the renderer stopped');
    expect(saved).toHaveLength(0);
  });

  it('FiguresPanel without a solved fit offers nothing to download', () => {
    renderWithProviders(<FiguresPanel fitId={null} solution={null} inputMatchesEvent fileStem="night-one" />);
    expect(screen.getByText(/Open a solved fit/)).toBeInTheDocument();
    expect(screen.queryByRole('button')).not.toBeInTheDocument();
  });
});
