import { render, screen } from '@testing-library/react';
import { MemoryRouter, Route, Routes, useLocation } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import { FitLinkRoute } from './fit-link';
import { paths } from '@/config/paths';

function Where() {
  const location = useLocation();
  return <p>At {`${location.pathname}${location.search}`}</p>;
}

describe('FitLinkRoute', () => {
  it("FitLinkRoute sends an e-mailed fit link to the desk's Fits section on that fit", async () => {
    render(
      <MemoryRouter initialEntries={[paths.fit('e 1', 'f1')]}>
        <Routes>
          <Route path="/events/:eventId/fits/:fitId" element={<FitLinkRoute />} />
          <Route path="/events/:eventId" element={<Where />} />
        </Routes>
      </MemoryRouter>,
    );
    expect(await screen.findByText('At /events/e%201?section=fits&fit=f1')).toBeInTheDocument();
  });
});
