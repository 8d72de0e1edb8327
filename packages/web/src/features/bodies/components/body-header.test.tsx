import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { BodyHeader } from './body-header';
import { QUILLON } from './test-body';
import { withFocusableLayout } from '@/testing/focusable-layout';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());
withFocusableLayout();

const EMPTY_BODY = { ...QUILLON, id: 'b2', name: 'Brask', designation: null, events: [] };

describe('BodyHeader', () => {
  it('BodyHeader lets a coordinator rename the body and clear its designation with PATCH', async () => {
    const calls = stubFetch((call) =>
      jsonResponse(200, { ...QUILLON, ...(call.body as object), designation: null }),
    );
    const user = userEvent.setup();
    renderWithProviders(<BodyHeader body={QUILLON} canEdit onDeleted={() => undefined} />);
    expect(screen.getByRole('heading', { name: 'Quillon' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Delete body' })).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Edit name and designation' }));
    const name = screen.getByRole('textbox', { name: /^Name/ });
    await user.clear(name);
    await user.type(name, 'Quillon I');
    await user.clear(screen.getByRole('textbox', { name: /^Designation/ }));
    await user.click(screen.getByRole('button', { name: 'Save' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]).toMatchObject({
      method: 'PATCH',
      url: '/api/bodies/b1',
      body: { name: 'Quillon I', designation: null },
    });
    expect(await screen.findByRole('button', { name: 'Edit name and designation' })).toBeInTheDocument();
  });

  it('BodyHeader asks before deleting a body without events, and shows the 409 when one was added meanwhile', async () => {
    const calls = stubFetch(() =>
      jsonResponse(409, { statusCode: 409, message: 'Brask still has 1 event (archived ones count)' }),
    );
    const onDeleted = vi.fn();
    const user = userEvent.setup();
    renderWithProviders(<BodyHeader body={EMPTY_BODY} canEdit onDeleted={onDeleted} />);
    await user.click(screen.getByRole('button', { name: 'Delete body' }));
    const dialog = await screen.findByRole('alertdialog', { name: 'Delete Brask?' });
    expect(dialog).toHaveTextContent('only while no event, active or archived, observes it');
    await user.click(within(dialog).getByRole('button', { name: 'Delete' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'Brask still has 1 event (archived ones count)',
    );
    expect(calls[0]).toMatchObject({ method: 'DELETE', url: '/api/bodies/b2' });
    expect(onDeleted).not.toHaveBeenCalled();
  });

  it('BodyHeader offers observers no controls', () => {
    renderWithProviders(<BodyHeader body={EMPTY_BODY} canEdit={false} onDeleted={() => undefined} />);
    expect(screen.queryByRole('button')).not.toBeInTheDocument();
  });
});
