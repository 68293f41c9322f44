// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Species } from '../../../../shared/schemas/register';
import type { WoodRequest } from '../../../../shared/schemas/seasons';
import { RequestForm } from '../components/request-form';
import type { IncomingLine } from '../lib/request-lines';

const RIBES_NOTE = 'Some places restrict moving Ribes; check with the local plant-health authority.';
const species: Species[] = [
  {
    id: '2014f893-2b54-451f-a7e0-af96337880a9',
    scientificName: 'Ribes nigrum',
    commonName: 'Blackcurrant',
    genus: 'Ribes',
    propagationMethods: ['hardwood'],
    defaultCuttingLengthCm: 22,
    defaultCuttingDiameterMm: 7,
    softTipCm: 10,
    strikeRatePrior: 0.7,
    priorStrength: 20,
    shadeTolerant: false,
    firstCropYears: 3,
    restrictionNote: RIBES_NOTE,
    notes: null,
    varieties: [{ id: '7b1c9c3e-5d7a-4f0e-8a61-2c3b4d5e6f70', speciesId: '2014f893-2b54-451f-a7e0-af96337880a9', name: 'Ledbury Sable', description: null, plantCount: 6 }],
  },
  {
    id: '8b4bae28-77f5-44a8-a714-64212c700b26',
    scientificName: 'Salix viminalis',
    commonName: 'Osier willow',
    genus: 'Salix',
    propagationMethods: ['live_stake', 'hardwood'],
    defaultCuttingLengthCm: 70,
    defaultCuttingDiameterMm: 15,
    softTipCm: 20,
    strikeRatePrior: 0.85,
    priorStrength: 20,
    shadeTolerant: false,
    firstCropYears: 2,
    restrictionNote: null,
    notes: null,
    varieties: [],
  },
];

const fetchMock = vi.fn<typeof fetch>();
beforeEach(() => vi.stubGlobal('fetch', fetchMock));
afterEach(() => {
  cleanup();
  fetchMock.mockReset();
  vi.unstubAllGlobals();
});

function renderForm(props: { request?: WoodRequest | null; incoming?: IncomingLine | null } = {}) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  const onSaved = vi.fn();
  render(
    <QueryClientProvider client={client}>
      <RequestForm seasonId="s1" request={props.request ?? null} species={species} incoming={props.incoming ?? null} onSaved={onSaved} />
    </QueryClientProvider>,
  );
  return { onSaved };
}

const plannerLine: IncomingLine = {
  speciesId: species[0].id,
  varietyId: null,
  treatment: 'willow',
  cuttings: 52,
  plan: { kind: 'hedgerow', lengthM: 30, spacingM: 1.2, rows: 1, positions: 26, cuttingsPerPosition: 2 },
};

async function fillDestination(user: ReturnType<typeof userEvent.setup>) {
  await user.type(screen.getByLabelText('Latitude'), '52.0855');
  await user.type(screen.getByLabelText('Longitude'), '-2.6385');
}

describe('RequestForm', () => {
  it('takes the planner line with its cuttings, plan and the species caution', () => {
    renderForm({ incoming: plannerLine });
    const line = screen.getByRole('group', { name: 'Line 1' });
    expect((within(line).getByLabelText('Cuttings', { selector: 'input' }) as HTMLInputElement).value).toBe('52');
    expect((within(line).getByLabelText('Species', { selector: 'select' }) as HTMLSelectElement).value).toBe(species[0].id);
    expect((within(line).getByLabelText('Treatment before sticking') as HTMLSelectElement).value).toBe('willow');
    expect(within(line).getByText('From the planner: 30 m hedgerow, 1 row, every 1.2 m: 26 positions, 2 cuttings each')).toBeTruthy();
    expect(within(line).getByText(RIBES_NOTE)).toBeTruthy();
  });

  it('files the request with the same body the server schema reads', async () => {
    fetchMock.mockResolvedValueOnce(new Response(JSON.stringify({ request: null }), { status: 200 }));
    const user = userEvent.setup();
    renderForm({ incoming: plannerLine });
    await fillDestination(user);
    await user.click(screen.getByRole('button', { name: 'File the request' }));
    await vi.waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(1));
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe('/api/seasons/s1/my-request');
    expect(init?.method).toBe('PUT');
    expect(JSON.parse(String(init?.body))).toMatchObject({
      destinationLat: 52.0855,
      destinationLon: -2.6385,
      maxDistanceKm: 25,
      status: 'filed',
      lines: [{ speciesId: species[0].id, varietyId: null, cuttings: 52, substitutesAllowed: false, treatment: 'willow', plan: plannerLine.plan }],
    });
  });

  it('shows the server’s error for lines.0.cuttings on that field, naming it', async () => {
    fetchMock.mockResolvedValueOnce(
      new Response(
        JSON.stringify({ error: { code: 'VALIDATION', message: 'Check the request lines.', fields: { 'lines.0.cuttings': 'at most 500 for this season' } } }),
        { status: 400 },
      ),
    );
    const user = userEvent.setup();
    renderForm({ incoming: plannerLine });
    await fillDestination(user);
    await user.click(screen.getByRole('button', { name: 'Save as draft' }));
    const message = await screen.findByText('Cuttings: at most 500 for this season');
    const input = within(screen.getByRole('group', { name: 'Line 1' })).getByLabelText('Cuttings', { selector: 'input' });
    expect(input.getAttribute('aria-invalid')).toBe('true');
    expect(input.getAttribute('aria-describedby')).toContain(message.id);
    expect(JSON.parse(String(fetchMock.mock.calls[0][1]?.body)).status).toBe('draft');
  });

  it('names every field the schema refuses before anything is sent', async () => {
    const user = userEvent.setup();
    renderForm();
    await user.click(screen.getByRole('button', { name: 'File the request' }));
    expect(await screen.findByText('Latitude must be a number')).toBeTruthy();
    expect(screen.getByText('Longitude must be a number')).toBeTruthy();
    expect(screen.getByText('Cuttings must be a number')).toBeTruthy();
    expect(screen.getByText('Choose a species for this line')).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('offers "any variety" and the species’ own varieties only', async () => {
    const user = userEvent.setup();
    renderForm();
    const line = screen.getByRole('group', { name: 'Line 1' });
    await user.selectOptions(within(line).getByLabelText('Species', { selector: 'select' }), species[0].id);
    const variety = within(line).getByLabelText('Variety') as HTMLSelectElement;
    expect([...variety.options].map((o) => o.textContent)).toEqual(['Any variety of this species', 'Ledbury Sable']);
    await user.selectOptions(within(line).getByLabelText('Species', { selector: 'select' }), species[1].id);
    expect([...(within(line).getByLabelText('Variety') as HTMLSelectElement).options].map((o) => o.textContent)).toEqual(['Any variety of this species']);
  });
});
