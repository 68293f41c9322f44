// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it } from 'vitest';
import type { HealthOverview } from '../../../../shared/schemas/health';
import { HealthOverviewView } from '../components/health-overview';

afterEach(cleanup);

const overview: HealthOverview = {
  lookbackMonths: 12,
  counts: { clean: 180, watch: 3, hold: 2, retired: 4, stale: 9 },
  attention: [
    { id: 'h1', code: 'WTH-0007', farmName: 'Wetherstone Farm', speciesName: 'Blackcurrant', varietyName: 'Hollow Lane', healthStatus: 'hold', lastInspectedOn: '2026-11-02', reason: 'On hold: a finding that travels in wood' },
    { id: 'w1', code: 'ARB-0015', farmName: 'Arrowbank Nursery', speciesName: 'Red currant', varietyName: null, healthStatus: 'watch', lastInspectedOn: '2026-09-18', reason: 'Watch: a finding to follow' },
    { id: 's1', code: 'LYN-0036', farmName: 'Lynchet Orchard', speciesName: 'Blackcurrant', varietyName: null, healthStatus: 'clean', lastInspectedOn: null, reason: 'Never inspected' },
  ],
  findingsByMonth: [
    { month: '2026-11', farmName: 'Wetherstone Farm', speciesName: 'Blackcurrant', pestName: 'Big bud mite', n: 2 },
    { month: '2026-11', farmName: 'Arrowbank Nursery', speciesName: 'Blackcurrant', pestName: 'Big bud mite', n: 1 },
    { month: '2026-10', farmName: 'Arrowbank Nursery', speciesName: 'Red currant', pestName: 'Currant leaf spot', n: 4 },
  ],
  notes: [{ id: 'n1', body: 'Rust on the hedge by the lane.', notedOn: '2026-11-20', authorName: 'Megan Pritchard', lat: null, lon: null }],
};

describe('HealthOverviewView', () => {
  it('counts plants by status with shapes, lists hold before watch before not inspected, and links to each plant', () => {
    render(
      <MemoryRouter>
        <HealthOverviewView overview={overview} />
      </MemoryRouter>,
    );
    const counts = screen.getByRole('region', { name: 'Plants by health status' });
    const hold = within(counts).getByText('Hold');
    expect(hold.querySelector('svg')?.getAttribute('data-shape')).toBe('octagon');
    expect(within(counts).getByText('180')).toBeTruthy();
    expect(within(counts).getByText('Not inspected')).toBeTruthy();

    const table = screen.getByRole('table', { name: 'Plants that need attention' });
    const codes = within(table).getAllByRole('link').map((a) => a.textContent);
    expect(codes).toEqual(['WTH-0007', 'Exposure and notices of WTH-0007', 'ARB-0015', 'LYN-0036']);
    expect(within(table).getByRole('link', { name: 'WTH-0007' }).getAttribute('href')).toBe('/plants/h1');
    // Only a plant on hold leads to the wood that may carry its finding.
    expect(within(table).getByRole('link', { name: 'Exposure and notices of WTH-0007' }).getAttribute('href')).toBe('/plants/h1/exposure');
    const holdBadge = within(table).getAllByText('Hold')[0];
    expect(holdBadge.parentElement?.querySelector('svg')?.getAttribute('data-shape')).toBe('octagon');
    expect(within(table).getByText('Not inspected')).toBeTruthy();
  });

  it('adds up findings by month and pest', () => {
    render(
      <MemoryRouter>
        <HealthOverviewView overview={overview} />
      </MemoryRouter>,
    );
    const table = screen.getByRole('table', { name: 'Findings by month and pest or disease' });
    const rows = within(table).getAllByRole('row');
    expect(within(rows[0]).getAllByRole('columnheader').map((h) => h.textContent)).toEqual(['Month', 'All findings', 'Currant leaf spot', 'Big bud mite']);
    expect(within(rows[1]).getByRole('rowheader').textContent).toMatch(/Nov 2026/);
    expect(within(rows[1]).getAllByRole('cell').map((c) => c.textContent)).toEqual(['3', '·', '3']);
    expect(screen.getByText('Rust on the hedge by the lane.')).toBeTruthy();
  });
});
