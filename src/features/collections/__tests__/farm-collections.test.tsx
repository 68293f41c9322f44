// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { FarmCollection } from '../../../../shared/schemas/allocation';
import { bundleLabels } from '../components/bundle-labels';
import { FarmCollectionsView } from '../components/farm-collections';

function item(code: string, growerName: string, startsAt: string | null, extra: Partial<FarmCollection> = {}): FarmCollection {
  return {
    bundleId: `id-${code}`,
    code,
    growerName,
    growerEmail: `${growerName.split(' ')[0].toLowerCase()}@example.org`,
    plantCode: 'HOL-0003',
    speciesName: 'Gooseberry',
    varietyName: 'Invicta',
    cuttings: 25,
    status: 'reserved',
    window: startsAt ? { startsAt, endsAt: new Date(new Date(startsAt).getTime() + 3 * 3600_000).toISOString() } : null,
    ...extra,
  };
}

const items = [
  item('B27-0003', 'Zoe Yew', null),
  item('B27-0002', 'Ben Birch', '2027-01-16T10:00:00.000Z', { status: 'collected' }),
  item('B27-0001', 'Ada Ash', '2027-01-09T10:00:00.000Z'),
];

const fetchMock = vi.fn<typeof fetch>();
beforeEach(() => vi.stubGlobal('fetch', fetchMock));
afterEach(() => {
  cleanup();
  fetchMock.mockReset();
  vi.unstubAllGlobals();
});

function renderView() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <MemoryRouter>
        <FarmCollectionsView items={items} timezone="Europe/London" seasonId="s1" farmId="f1" />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

describe('FarmCollectionsView', () => {
  it('lists growers by when they come, with status words and shapes', () => {
    renderView();
    const visits = screen.getAllByTestId('collection-visit');
    expect(visits.map((v) => within(v).getByRole('heading').textContent)).toEqual(['Ada Ash', 'Ben Birch', 'Zoe Yew']);
    expect(within(visits[0]).getByText('Sat 9 Jan 2027, 10:00–13:00')).toBeTruthy();
    expect(within(visits[2]).getByText(/No window set/)).toBeTruthy();
    const collected = within(visits[1]).getByText('Collected');
    expect(collected.parentElement?.querySelector('svg')?.getAttribute('data-shape')).toBe('filled-circle');
    expect(screen.getByText(/1 collected/)).toBeTruthy();
  });

  it('marks a bundle collected with one big button', async () => {
    fetchMock.mockResolvedValueOnce(new Response(JSON.stringify({ id: 'id-B27-0001', status: 'collected' }), { status: 200 }));
    fetchMock.mockResolvedValue(new Response(JSON.stringify({ items, total: 3 }), { status: 200 }));
    const user = userEvent.setup();
    renderView();
    await user.click(screen.getByRole('button', { name: /Mark B27-0001: 25 Gooseberry as collected/ }));
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe('/api/bundles/id-B27-0001/collection');
    expect(init?.method).toBe('POST');
    expect(JSON.parse(String(init?.body))).toEqual({ collected: true });
    expect(screen.getByRole('button', { name: /Mark B27-0002: 25 Gooseberry as not collected/ })).toBeTruthy();
  });
});

describe('bundleLabels', () => {
  it('points the QR code at the source plant when its id is known, else holds the bundle code', () => {
    const labels = bundleLabels(
      [item('B27-0002', 'Ben Birch', null), item('B27-0001', 'Ada Ash', null, { plantCode: 'HOL-0009' }), item('B27-0004', 'Cy Cedar', null, { status: 'cancelled' })],
      new Map([['HOL-0003', 'plant-3']]),
      'https://coop.example',
    );
    expect(labels.map((l) => l.code)).toEqual(['B27-0001', 'B27-0002']);
    expect(labels[1]).toMatchObject({ qrText: 'https://coop.example/plants/plant-3', qrOpensPlant: true, growerName: 'Ben Birch', cuttings: 25 });
    expect(labels[0]).toMatchObject({ qrText: 'B27-0001', qrOpensPlant: false });
  });
});
