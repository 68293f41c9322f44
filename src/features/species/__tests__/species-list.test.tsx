// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Species } from '../../../../shared/schemas/register';
import { SpeciesList } from '../components/species-list';

const blackcurrant: Species = {
  id: '2014f893-2b54-451f-a7e0-af96337880a9',
  scientificName: 'Ribes nigrum',
  commonName: 'Blackcurrant',
  genus: 'Ribes',
  propagationMethods: ['hardwood'],
  defaultCuttingLengthCm: 20,
  defaultCuttingDiameterMm: 6,
  softTipCm: 10,
  strikeRatePrior: 0.75,
  priorStrength: 20,
  shadeTolerant: true,
  firstCropYears: 2,
  restrictionNote: 'Some places restrict moving Ribes; check with the plant-health authority.',
  notes: null,
  varieties: [{ id: 'v1', speciesId: '2014f893-2b54-451f-a7e0-af96337880a9', name: 'Ledbury Sable', description: 'Late, heavy cropper.', plantCount: 12 }],
};

const fetchMock = vi.fn<typeof fetch>();
beforeEach(() => vi.stubGlobal('fetch', fetchMock));
afterEach(() => {
  cleanup();
  fetchMock.mockReset();
  vi.unstubAllGlobals();
});

function renderList(canEdit: boolean) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <SpeciesList species={[blackcurrant]} canEdit={canEdit} />
    </QueryClientProvider>,
  );
}

describe('SpeciesList', () => {
  it('shows names, cutting size, the strike rate as a percentage and the caution, without edit buttons for a member', () => {
    renderList(false);
    const card = screen.getByRole('article', { name: 'Blackcurrant' });
    expect(within(card).getByText(/Ribes nigrum/)).toBeTruthy();
    expect(within(card).getByText('Hardwood cuttings')).toBeTruthy();
    expect(within(card).getByText(/20 cm long, 6 mm thick/)).toBeTruthy();
    expect(within(card).getByText(/^75 %/)).toBeTruthy();
    expect(within(card).getByText('Plant-health caution')).toBeTruthy();
    expect(within(card).getByText('Ledbury Sable')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Edit|Add/ })).toBeNull();
  });

  it('lets a coordinator edit a species, sending the strike rate as a fraction and naming a bad field', async () => {
    fetchMock.mockResolvedValueOnce(new Response(JSON.stringify({ ...blackcurrant, strikeRatePrior: 0.8 }), { status: 200 }));
    const user = userEvent.setup();
    renderList(true);
    await user.click(screen.getByRole('button', { name: 'Edit Blackcurrant' }));

    const rate = screen.getByLabelText('Reference strike rate (%)');
    await user.clear(rate);
    await user.type(rate, '150');
    await user.click(screen.getByRole('button', { name: 'Save the species' }));
    expect(await screen.findByText('Strike rate is between 0 and 100 %')).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();

    await user.clear(rate);
    await user.type(rate, '80');
    await user.click(screen.getByRole('button', { name: 'Save the species' }));
    await vi.waitFor(() => expect(fetchMock).toHaveBeenCalled());
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe(`/api/species/${blackcurrant.id}`);
    expect(init?.method).toBe('PATCH');
    expect(JSON.parse(String(init?.body)).strikeRatePrior).toBe(0.8);
  });
});
