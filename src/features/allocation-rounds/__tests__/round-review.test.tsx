// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { REASON_TEXT, type RoundBundle, type RoundLine, type RoundView } from '../../../../shared/schemas/allocation';
import type { OfferRow } from '../../../../shared/schemas/seasons';
import { RoundReview } from '../components/round-review';

const bundle: RoundBundle = {
  id: 'b1',
  code: null,
  offerId: 'o1',
  lineId: 'l1',
  plantId: 'p1',
  plantCode: 'HOL-0012',
  plantStatus: 'clean',
  farmId: 'f1',
  farmName: 'Hollow Farm',
  growerId: 'g1',
  growerName: 'Ada Ash',
  speciesName: 'Blackcurrant',
  varietyName: 'Ben Hope',
  cuttings: 40,
  distanceKm: 12.4,
  locked: false,
  status: 'reserved',
  problem: null,
};

const filled: RoundLine = {
  lineId: 'l1',
  growerId: 'g1',
  growerName: 'Ada Ash',
  speciesName: 'Blackcurrant',
  varietyName: 'Ben Hope',
  substitutesAllowed: false,
  maxDistanceKm: 30,
  asked: 40,
  allocated: 40,
  fill: 1,
  reason: 'filled',
};

const unfilled: RoundLine = {
  lineId: 'l2',
  growerId: 'g2',
  growerName: 'Ben Birch',
  speciesName: 'Fig',
  varietyName: null,
  substitutesAllowed: false,
  maxDistanceKm: 10,
  asked: 20,
  allocated: 0,
  fill: 0,
  reason: 'beyond_distance',
};

const proposed: RoundView = {
  id: 'r1',
  seasonId: 's1',
  seasonName: '2027 dormant hardwood',
  number: 1,
  status: 'proposed',
  running: null,
  error: null,
  createdAt: '2027-01-10T10:00:00.000Z',
  approvedAt: null,
  notifiedAt: null,
  stats: {
    arcs: 14,
    minFill: 0.5,
    totalCuttings: 40,
    travelKm: 24.8,
    optimal: true,
    gap: 0,
    seconds: 0.4,
    stages: [
      { name: 'fairness', objective: 0.5, status: 'Optimal', seconds: 0.1 },
      { name: 'volume', objective: 40, status: 'Optimal', seconds: 0.1 },
      { name: 'travel', objective: 24.8, status: 'optimal_within_gap', seconds: 0.2 },
    ],
  },
  bundles: [bundle],
  lines: [filled, unfilled],
  supply: [
    { speciesName: 'Blackcurrant', varietyName: 'Ben Hope', offered: 60, asked: 40, allocated: 40 },
    { speciesName: 'Fig', varietyName: null, offered: 0, asked: 20, allocated: 0 },
  ],
  emails: [],
};

const fetchMock = vi.fn<typeof fetch>();
const json = (body: unknown, status = 200) => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

beforeEach(() => vi.stubGlobal('fetch', fetchMock));
afterEach(() => {
  cleanup();
  fetchMock.mockReset();
  vi.unstubAllGlobals();
});

function renderReview() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <MemoryRouter>
        <RoundReview roundId="r1" />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

describe('RoundReview', () => {
  it('shows the stage and the elapsed time while the server solves', async () => {
    const startedAt = new Date(Date.now() - 7_000).toISOString();
    fetchMock.mockImplementation(async () =>
      json({ ...proposed, status: 'draft', stats: null, bundles: [], lines: [], running: { stage: 'solving: 12 offers, 5 request lines', startedAt } }),
    );
    renderReview();
    expect((await screen.findByTestId('round-stage')).textContent).toBe('solving: 12 offers, 5 request lines');
    expect(screen.getByText('Working out the allocation')).toBeTruthy();
    expect(screen.getByText((_, el) => el?.tagName === 'P' && /^Running for \d+ s\./.test(el.textContent ?? ''))).toBeTruthy();
    expect(screen.getByRole('progressbar', { name: 'Step 2 of 3' })).toBeTruthy();
    // No review yet: nothing to approve while solving.
    expect(screen.queryByRole('button', { name: 'Approve and send pickup slips' })).toBeNull();
  });

  it('explains why a line gets nothing, with its fill as a number', async () => {
    fetchMock.mockImplementation(async () => json(proposed));
    renderReview();
    const lines = await screen.findAllByTestId('request-line');
    const ben = lines.find((l) => within(l).queryByText('Ben Birch'))!;
    expect(within(ben).getByText(REASON_TEXT.beyond_distance)).toBeTruthy();
    expect(within(ben).getByText(/Gets nothing/)).toBeTruthy();
    expect(within(ben).getByText('0 % filled')).toBeTruthy();
    const ada = lines.find((l) => within(l).queryByText('Ada Ash'))!;
    expect(within(ada).getByText('100 % filled')).toBeTruthy();
    expect(within(ada).getByText(/from/).textContent).toMatch(/HOL-0012 at Hollow Farm, 12.4 km/);
    // The summary: lowest fill share, optimal.
    expect(screen.getByText('Lowest fill share').nextElementSibling?.textContent).toBe('50 %');
    expect(screen.getByText('Optimal').nextElementSibling?.textContent).toBe('Yes');
  });

  it('edits a bundle in place and shows the server refusal under the box', async () => {
    fetchMock.mockImplementation(async (_input, init) => {
      if (init?.method === 'PATCH') {
        return json({ error: { code: 'BAD_REQUEST', message: 'Only 12 more cuttings are free on plant HOL-0012.', fields: { cuttings: 'at most 12' } } }, 400);
      }
      return json(proposed);
    });
    const user = userEvent.setup();
    renderReview();
    const box = await screen.findByRole('spinbutton', { name: 'Cuttings from HOL-0012 for Ada Ash' });
    await user.clear(box);
    await user.type(box, '60');
    await user.click(screen.getByRole('button', { name: 'Save' }));
    expect(await screen.findByText('Only 12 more cuttings are free on plant HOL-0012.')).toBeTruthy();
    const patch = fetchMock.mock.calls.find(([, init]) => init?.method === 'PATCH')!;
    expect(patch[0]).toBe('/api/rounds/r1/bundles/b1');
    expect(JSON.parse(String(patch[1]?.body))).toEqual({ cuttings: 60 });
  });

  it('lists what approval does, and marks bundles the server refuses', async () => {
    fetchMock.mockImplementation(async (_input, init) => {
      if (init?.method === 'POST') {
        return json({ error: { code: 'CONFLICT', message: 'Bundles from plants that may no longer give wood: HOL-0012. Change them first.', fields: { bundles: 'b1' } } }, 409);
      }
      return json(proposed);
    });
    const user = userEvent.setup();
    renderReview();
    await user.click((await screen.findAllByRole('button', { name: 'Approve and send pickup slips' }))[0]);
    const dialog = screen.getByRole('dialog', { name: 'Approve and send pickup slips?', hidden: true });
    expect(within(dialog).getByText(/e-mail a pickup slip to/).textContent).toMatch(/1 grower/);
    expect(within(dialog).getByText(/e-mail a collection list to/).textContent).toMatch(/1 farm/);
    await user.click(within(dialog).getByRole('button', { name: 'Yes, approve and send', hidden: true }));
    expect(await screen.findByText('Approval refused')).toBeTruthy();
    const row = screen.getAllByTestId('bundle-row')[0];
    expect(row.getAttribute('data-problem')).toBe('true');
    expect(screen.getByText(/Approval was refused for this bundle/)).toBeTruthy();
  });

  it('after approval shows the e-mail log and sends failed ones again', async () => {
    const approved: RoundView = {
      ...proposed,
      status: 'approved',
      approvedAt: '2027-01-10T11:00:00.000Z',
      bundles: [{ ...bundle, code: 'B27-0001' }],
      emails: [
        { kind: 'pickup_slip', to: 'ada@example.org', status: 'sent', attempts: 1, lastError: null },
        { kind: 'farm_collections', to: 'hollow@example.org', status: 'failed', attempts: 3, lastError: 'connection refused' },
      ],
    };
    fetchMock.mockImplementation(async (_input, init) => {
      if (init?.method === 'POST') return json({ round: { ...approved, status: 'notified' }, mail: { sent: 1, duplicate: 0, failed: 0 } });
      return json(approved);
    });
    const user = userEvent.setup();
    renderReview();
    const log = await screen.findByRole('table', { name: 'E-mails sent for this round' });
    expect(within(log).getByText('connection refused')).toBeTruthy();
    expect(within(log).getByText('Failed')).toBeTruthy();
    expect(screen.getByText('B27-0001')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Send failed ones again' }));
    expect(await screen.findByText('Sent again: 1; still failing: 0.')).toBeTruthy();
    expect(fetchMock.mock.calls.some(([url, init]) => url === '/api/rounds/r1/resend' && init?.method === 'POST')).toBe(true);
  });
  it('adds a bundle by hand from a farm\'s compatible offers', async () => {
    const figOffer: OfferRow = {
      plantId: 'p9',
      code: 'HOL-0030',
      farmId: 'f1',
      farmName: 'Hollow Farm',
      speciesName: 'Fig',
      varietyName: 'Garden Wall Purple',
      role: 'stock_bed',
      healthStatus: 'clean',
      lastInspectedOn: '2026-11-01',
      eligible: true,
      whyNot: null,
      cuttingLengthCm: 20,
      softTipCm: 5,
      capFraction: 0.9,
      offer: { id: 'o9', shootCount: null, meanShootLengthCm: null, directCount: 30, estimatedYield: 30, offered: 27, reserved: 0, withdrawnAt: null, withdrawnReason: null },
    };
    const blackcurrant: OfferRow = { ...figOffer, plantId: 'p1', code: 'HOL-0012', speciesName: 'Blackcurrant', varietyName: 'Ben Hope', offer: { ...figOffer.offer!, id: 'o1' } };
    fetchMock.mockImplementation(async (input, init) => {
      const url = String(input);
      if (url.startsWith('/api/farms')) return json({ items: [{ id: 'f1', code: 'HOL', name: 'Hollow Farm', address: '', lat: 52, lon: -2, memberCount: 1, plantCount: 2 }], total: 1 });
      if (url === '/api/seasons/s1/farms/f1/offers') return json({ items: [blackcurrant, figOffer], total: 2 });
      if (init?.method === 'POST' && url === '/api/rounds/r1/bundles') return json(proposed, 201);
      return json(proposed);
    });
    const user = userEvent.setup();
    renderReview();
    await user.click(await screen.findByRole('button', { name: 'Add a bundle for this line' }));
    const dialog = screen.getByRole('dialog', { name: 'Add a bundle', hidden: true });
    await user.selectOptions(within(dialog).getByRole('combobox', { name: 'Farm', hidden: true }), 'f1');
    // Only the fig plant fits the fig line; it starts at what the line still lacks.
    const choice = await within(dialog).findByRole('radio', { hidden: true });
    expect(choice.closest('label')?.textContent).toMatch(/HOL-0030.*27 free/);
    await user.click(choice);
    expect((within(dialog).getByRole('spinbutton', { name: /Cuttings/, hidden: true }) as HTMLInputElement).value).toBe('20');
    await user.click(within(dialog).getByRole('button', { name: 'Add the bundle', hidden: true }));
    const post = fetchMock.mock.calls.find(([url, init]) => url === '/api/rounds/r1/bundles' && init?.method === 'POST')!;
    expect(JSON.parse(String(post[1]?.body))).toEqual({ offerId: 'o9', lineId: 'l2', cuttings: 20 });
  });
});
