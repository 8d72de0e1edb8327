import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { CsvImportDialog } from './csv-import-dialog';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Fluent forms re-render on every keystroke; on a loaded machine a test takes seconds in jsdom.
vi.setConfig({ testTimeout: 30_000 });

const CSV = [
  'station,type,disappearance,disappearanceSigmaSeconds,reappearance,reappearanceSigmaSeconds',
  'kestrel-hill,positive,2029-05-17T03:12:31.25Z,0.04,2029-05-17T03:12:49.9Z,0.05',
  'brackenmoor,positive,2029-05-17T03:12:30.1Z,0.08,2029-05-17T03:12:20Z,0.08',
].join('\n');

async function chooseFile() {
  const user = userEvent.setup();
  await user.click(screen.getByRole('button', { name: 'Import CSV…' }));
  await user.upload(screen.getByLabelText('CSV file'), new File([CSV], 'chords.csv', { type: 'text/csv' }));
  return user;
}

describe('CsvImportDialog', () => {
  it('CsvImportDialog shows the row error from the preview and never sends the import', async () => {
    const calls = stubFetch(() =>
      jsonResponse(400, {
        issues: [{ row: 3, column: 'reappearance', message: 'reappearance must come after disappearance' }],
      }),
    );
    renderWithProviders(<CsvImportDialog eventId="e1" />);
    await chooseFile();
    expect(await screen.findByRole('list', { name: 'Row problems' })).toHaveTextContent(
      'Row 3, column reappearance: reappearance must come after disappearance',
    );
    expect(screen.getByRole('button', { name: 'Import' })).toBeDisabled();
    expect(calls.map((c) => c.url)).toEqual(['/api/events/e1/chords/import?preview=1']);
  });

  it('CsvImportDialog previews a clean file and imports it only when asked', async () => {
    const calls = stubFetch((call) =>
      call.url.endsWith('preview=1')
        ? jsonResponse(200, {
            chords: [
              { station: 'kestrel-hill', type: 'positive' },
              { station: 'brackenmoor', type: 'positive' },
            ],
          })
        : jsonResponse(201, { chords: [] }),
    );
    renderWithProviders(<CsvImportDialog eventId="e1" />);
    const user = await chooseFile();
    expect(await screen.findByText('2 chords will be added:')).toBeInTheDocument();
    expect(screen.getByRole('table', { name: 'Chords to import' })).toHaveTextContent('brackenmoor');
    expect(calls).toHaveLength(1);
    await user.click(screen.getByRole('button', { name: 'Import' }));
    await waitFor(() => expect(calls.map((c) => c.url)).toContain('/api/events/e1/chords/import'));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
  });

  it('CsvImportDialog refuses an empty file without asking the server', async () => {
    const calls = stubFetch(() => jsonResponse(200, []));
    renderWithProviders(<CsvImportDialog eventId="e1" />);
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Import CSV…' }));
    await user.upload(screen.getByLabelText('CSV file'), new File([], 'empty.csv', { type: 'text/csv' }));
    expect(await screen.findByText('the file is empty')).toBeInTheDocument();
    expect(calls).toHaveLength(0);
  });
});
