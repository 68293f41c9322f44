// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import type { PickupSlip, PickupStop } from '../../../../shared/schemas/allocation';
import { PickupSlipView } from '../components/pickup-slip';
import { formatWindow } from '../lib/farm-time';

afterEach(cleanup);

function stop(farmName: string, extra: Partial<PickupStop> = {}): PickupStop {
  return {
    farmId: `id-${farmName}`,
    farmName,
    address: `${farmName} Lane 1`,
    directions: '',
    lat: 52,
    lon: -2,
    timezone: 'Europe/London',
    windows: [],
    bundles: [{ id: `b-${farmName}`, code: `B27-00${farmName.length}`, speciesName: 'Blackcurrant', varietyName: 'Ben Hope', plantCode: 'HOL-0001', cuttings: 30, status: 'reserved' }],
    distanceKm: 10,
    ...extra,
  };
}

const slip: PickupSlip = {
  seasonId: 's1',
  seasonName: '2027 dormant hardwood',
  seasonKind: 'dormant_hardwood',
  growerName: 'Ada Ash',
  start: { lat: 52.1, lon: -2.6, label: 'Lane hedge, Withington' },
  // The server sends the stops already in visiting order, which is not alphabetical here.
  stops: [
    stop('Wetherstone Farm', {
      directions: 'Second gate after the chapel.',
      timezone: 'Pacific/Auckland',
      windows: [{ startsAt: '2027-01-09T20:00:00.000Z', endsAt: '2027-01-09T23:00:00.000Z', note: 'Ring the bell' }],
    }),
    stop('Arrowbank Nursery'),
    stop('Lynchet Orchard'),
  ],
  visitingOrder: ['id-Wetherstone Farm', 'id-Arrowbank Nursery', 'id-Lynchet Orchard'],
  roundTripKm: 48.3,
  cautions: ['Keep cuttings cool and moist from the moment they are cut.', 'Pruning tools are sharp: cut away from your body.'],
};

describe('PickupSlipView', () => {
  it('lists the farms in the order given, numbered', () => {
    render(<PickupSlipView slip={slip} />);
    const order = screen.getByRole('list', { name: 'Farms in visiting order' });
    const headings = within(order).getAllByRole('heading', { level: 2 }).map((h) => h.textContent);
    expect(headings).toEqual(['1Stop 1: Wetherstone Farm', '2Stop 2: Arrowbank Nursery', '3Stop 3: Lynchet Orchard']);
    expect(screen.getByText(/48.3 km/)).toBeTruthy();
  });

  it('shows windows in the farm time zone, directions, bundles and cautions', () => {
    render(<PickupSlipView slip={slip} />);
    const first = screen.getAllByTestId('slip-stop')[0];
    // 20:00 UTC is 09:00 the next morning in Auckland (summer time).
    expect(within(first).getByText('Sun 10 Jan 2027, 09:00–12:00')).toBeTruthy();
    expect(within(first).getByText('When to come (Pacific/Auckland time)')).toBeTruthy();
    expect(within(first).getByText('Ring the bell')).toBeTruthy();
    expect(within(first).getByText('Second gate after the chapel.')).toBeTruthy();
    // Shown as a list on a phone and a table on wider screens and paper.
    expect(within(first).getAllByText('B27-0016').length).toBeGreaterThan(0);
    expect(within(first).getAllByText('Reserved').length).toBeGreaterThan(0);
    const second = screen.getAllByTestId('slip-stop')[1];
    expect(within(second).getByText(/No pickup window is set/)).toBeTruthy();
    const cautions = screen.getByRole('region', { name: 'Handling and safety' });
    expect(within(cautions).getByText(/cool and moist/)).toBeTruthy();
    expect(within(cautions).getByRole('heading', { name: 'Your safety' })).toBeTruthy();
    expect(within(cautions).getByText(/Pruning tools are sharp/).closest('div')?.querySelector('h3')?.textContent).toBe('Your safety');
    expect(screen.getByRole('button', { name: 'Print the slip' })).toBeTruthy();
  });

  it('formats a window that runs past midnight with both ends', () => {
    expect(formatWindow('2027-01-09T22:00:00.000Z', '2027-01-10T01:00:00.000Z', 'Europe/London')).toBe('Sat 9 Jan 2027, 22:00 to Sun 10 Jan 2027, 01:00');
  });
});
