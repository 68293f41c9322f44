// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { OfferRow } from '../../../../shared/schemas/seasons';
import { offerCap, plantYield } from '../../../../shared/yield';
import { OfferRowEditor } from '../components/offer-row-editor';
import { checkOffer } from '../lib/offer-form';

// A blackcurrant stock bed as the server lists it (cutting 22 cm, soft tip 10 cm, cap 0.9).
const row: OfferRow = {
  plantId: '6f9d8a52-3c1e-4b8e-9a51-0d4c2b7e1a10',
  code: 'WTH-0004',
  farmId: 'f1',
  farmName: 'Wetherstone Farm',
  speciesName: 'Blackcurrant',
  varietyName: 'Ledbury Sable',
  role: 'stock_bed',
  healthStatus: 'clean',
  lastInspectedOn: '2026-09-01',
  eligible: true,
  whyNot: null,
  cuttingLengthCm: 22,
  softTipCm: 10,
  capFraction: 0.9,
  offer: null,
};

const fetchMock = vi.fn<typeof fetch>();
beforeEach(() => vi.stubGlobal('fetch', fetchMock));
afterEach(() => {
  cleanup();
  fetchMock.mockReset();
  vi.unstubAllGlobals();
});

function renderRow(r: OfferRow = row, canChange = true) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <OfferRowEditor seasonId="s1" row={r} canChange={canChange} />
    </QueryClientProvider>,
  );
}

const estimateText = () => screen.getByTestId('offer-estimate').textContent?.replace(/\s+/g, ' ') ?? '';

describe('OfferRowEditor', () => {
  it.each([
    [18, 95],
    [21, 65.5],
    [7, 31.9],
    [40, 10],
  ])('shows, as the shoots are typed, the estimate and cap of shared/yield (%i shoots of %s cm)', async (shoots, length) => {
    const user = userEvent.setup();
    renderRow();
    await user.type(screen.getByLabelText('New shoots'), String(shoots));
    await user.type(screen.getByLabelText('Mean length (cm)'), String(length));
    const estimate = plantYield({ shootCount: shoots, meanShootLengthCm: length, softTipCm: 10, cuttingLengthCm: 22 });
    const cap = offerCap(estimate, 0.9);
    expect(estimateText()).toContain(`Estimate ${estimate} cuttings · may offer up to ${cap}`);
  });

  it('works from a direct count too, capped by the role', async () => {
    const user = userEvent.setup();
    renderRow({ ...row, role: 'fruiting_bush', capFraction: 0.33 });
    await user.selectOptions(screen.getByLabelText('Measured by'), 'direct');
    await user.type(screen.getByLabelText('Cuttings counted'), '100');
    expect(estimateText()).toContain(`Estimate 100 cuttings · may offer up to ${offerCap(100, 0.33)}`);
  });

  it('sends the counts and leaves the offer out, so the server offers the cap', async () => {
    fetchMock.mockResolvedValueOnce(
      new Response(JSON.stringify({ offer: { id: 'o1', estimatedYield: 54, offered: 48, reserved: 0, capFraction: 0.9 }, max: 48 }), { status: 200 }),
    );
    const user = userEvent.setup();
    renderRow();
    await user.type(screen.getByLabelText('New shoots'), '18');
    await user.type(screen.getByLabelText('Mean length (cm)'), '95');
    await user.click(screen.getByRole('button', { name: 'Offer this wood' }));
    expect(await screen.findByText('Saved: 48 cuttings offered (estimate 54, at most 48).')).toBeTruthy();
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe(`/api/seasons/s1/offers/${row.plantId}`);
    expect(init?.method).toBe('PUT');
    expect(JSON.parse(String(init?.body))).toEqual({ shootCount: 18, meanShootLengthCm: 95 });
  });

  it('names the field when the offer is above the cap, and sends nothing', async () => {
    const user = userEvent.setup();
    renderRow();
    await user.type(screen.getByLabelText('New shoots'), '10');
    await user.type(screen.getByLabelText('Mean length (cm)'), '100');
    await user.type(screen.getByLabelText('Cuttings offered'), '999');
    await user.click(screen.getByRole('button', { name: 'Offer this wood' }));
    const cap = offerCap(plantYield({ shootCount: 10, meanShootLengthCm: 100, softTipCm: 10, cuttingLengthCm: 22 }), 0.9);
    expect(await screen.findByText(new RegExp(`^Cuttings offered is at most ${cap}`))).toBeTruthy();
    expect(screen.getByLabelText('Cuttings offered').getAttribute('aria-invalid')).toBe('true');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('puts a refusal of the server on the field it names', async () => {
    fetchMock.mockResolvedValueOnce(
      new Response(JSON.stringify({ error: { code: 'CONFLICT', message: '12 cuttings are already reserved from this plant.', fields: { offered: 'at least 12 (reserved)' } } }), {
        status: 409,
      }),
    );
    const user = userEvent.setup();
    renderRow();
    await user.type(screen.getByLabelText('New shoots'), '10');
    await user.type(screen.getByLabelText('Mean length (cm)'), '100');
    await user.type(screen.getByLabelText('Cuttings offered'), '5');
    await user.click(screen.getByRole('button', { name: 'Offer this wood' }));
    expect(await screen.findByText('Cuttings offered: at least 12 (reserved)')).toBeTruthy();
  });

  it('shows the saved offer and no buttons when offers are closed', () => {
    renderRow({ ...row, offer: { id: 'o1', shootCount: 18, meanShootLengthCm: 95, directCount: null, estimatedYield: 54, offered: 48, reserved: 6, withdrawnAt: null, withdrawnReason: null } }, false);
    const form = screen.getByRole('form');
    expect(within(form).getByText(/On offer: 48/)).toBeTruthy();
    expect(within(form).getByText('6 already reserved')).toBeTruthy();
    expect(within(form).queryByRole('button')).toBeNull();
    expect((screen.getByLabelText('New shoots') as HTMLInputElement).disabled).toBe(true);
  });
});

describe('checkOffer', () => {
  it('asks for both shoot count and length', () => {
    const { errors } = checkOffer(row, { mode: 'shoots', shootCount: '12', meanShootLengthCm: '', directCount: '', offered: '' });
    expect(errors.meanShootLengthCm).toBe('Mean shoot length is required with a shoot count');
  });
});
