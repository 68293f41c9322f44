// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { planFigures, safetyCautions, seasonGuidance, shadeSideGuidance, type Layout } from '../../../../shared/planner';
import type { PlannerEstimate, PlannerEstimateBody, PlannerStrikeRate } from '../../../../shared/schemas/planner';
import type { Species } from '../../../../shared/schemas/register';
import { strikeRateFor } from '../../../../shared/strike-rate';
import { Planner } from '../components/planner';
import type { PlanStart } from '../lib/plan-form';
import { pct, tenths, whole } from '../lib/words';

const gooseberry: Species = {
  id: '6f41210c-4596-4a02-96ba-53378a6c163d',
  scientificName: 'Ribes uva-crispa',
  commonName: 'Gooseberry',
  genus: 'Ribes',
  propagationMethods: ['hardwood'],
  defaultCuttingLengthCm: 25,
  defaultCuttingDiameterMm: 7,
  softTipCm: 10,
  strikeRatePrior: 0.6,
  priorStrength: 20,
  shadeTolerant: true,
  firstCropYears: 3,
  restrictionNote: 'Ribes may be restricted near white pines; ask the plant-health authority.',
  notes: null,
  varieties: [{ id: '1c2d3e4f-5a6b-4c7d-8e9f-0a1b2c3d4e5f', speciesId: '6f41210c-4596-4a02-96ba-53378a6c163d', name: 'Hedgehog Gold', description: null, plantCount: 5 }],
};

// The server's answer, made the way the server makes it: a learned rate, then planFigures.
function serverAnswer(body: PlannerEstimateBody): PlannerEstimate {
  const estimate = strikeRateFor(gooseberry, body.treatment ?? 'none', { reports: 3, stuck: 120, rooted: 90 });
  const strikeRate: PlannerStrikeRate = { ...estimate, scope: 'species', treatment: body.treatment ?? 'none' };
  const layout: Layout = body.positions != null ? { positions: body.positions } : { lengthM: body.lengthM!, spacingM: body.spacingM!, rows: body.rows ?? 1 };
  const f = planFigures({ layout, cuttingsPerPosition: body.cuttingsPerPosition ?? 2, strikeRate: strikeRate.rate, target: body.target ?? undefined });
  return { ...f, strikeRate };
}

const fetchMock = vi.fn<typeof fetch>();
beforeEach(() => {
  fetchMock.mockImplementation(async (_url, init) => new Response(JSON.stringify(serverAnswer(JSON.parse(String(init?.body)))), { status: 200 }));
  vi.stubGlobal('fetch', fetchMock);
});
afterEach(() => {
  cleanup();
  fetchMock.mockReset();
  vi.unstubAllGlobals();
});

function renderPlanner(start: PlanStart = { lengthM: 30 }, onAddToRequest = vi.fn()) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <Planner
        species={[gooseberry]}
        hemisphere="south"
        seasonKind="dormant_hardwood"
        requestSeasons={[{ id: 's1', name: 'Dormant hardwood 2027' }]}
        start={start}
        onAddToRequest={onAddToRequest}
      />
    </QueryClientProvider>,
  );
  return { onAddToRequest };
}

describe('Planner', () => {
  it('starts from a hedgerow length in the address and asks for a species first', () => {
    renderPlanner({ lengthM: 123.4 });
    expect((screen.getByLabelText('Length (m)') as HTMLInputElement).value).toBe('123.4');
    expect(screen.getByText('Choose a species', { selector: 'li' })).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('shows the figures of shared/planner.ts for the server’s strike rate, and where the rate came from', async () => {
    const user = userEvent.setup();
    renderPlanner();
    await user.selectOptions(screen.getByLabelText('Species', { selector: 'select' }), gooseberry.id);
    await user.selectOptions(screen.getByLabelText('Treatment before sticking'), 'both');
    await screen.findByText('Checked by the Heelwood server.');

    const rate = strikeRateFor(gooseberry, 'both', { reports: 3, stuck: 120, rooted: 90 });
    const f = planFigures({ layout: { lengthM: 30, spacingM: 1.2, rows: 1 }, cuttingsPerPosition: 2, strikeRate: rate.rate, target: { rooted: 26, confidence: 0.9 } });
    expect(screen.getByTestId('plan-positions').textContent).toBe(whole(f.positions));
    expect(screen.getByTestId('plan-ask').textContent).toBe(whole(f.cuttings));
    expect(screen.getByTestId('plan-fill').textContent).toBe(pct(f.fillProbability));
    expect(screen.getByTestId('plan-empty').textContent).toBe(tenths(f.expectedEmptyPositions));
    expect(screen.getByTestId('plan-target').textContent).toBe(whole(f.cuttingsForTarget!));
    expect(screen.getByTestId('plan-rate').textContent).toBe(pct(rate.rate));
    expect(screen.getByText(`(90 % interval ${pct(rate.low)} to ${pct(rate.high)})`)).toBeTruthy();
    expect(screen.getByText(/Learned from 3 strike reports on all Gooseberry with willow soak and hormone: 90 of 120 cuttings rooted/)).toBeTruthy();

    // What was asked of the server.
    const body = JSON.parse(String(fetchMock.mock.calls.at(-1)?.[1]?.body));
    expect(body).toMatchObject({ lengthM: 30, spacingM: 1.2, rows: 1, cuttingsPerPosition: 2, speciesId: gooseberry.id, treatment: 'both', target: { rooted: 26, confidence: 0.9 } });
  });

  it('asks for N rooted plants with a chosen confidence', async () => {
    const user = userEvent.setup();
    renderPlanner({});
    await user.click(screen.getByLabelText(/A number of rooted plants/));
    await user.type(screen.getByLabelText('Rooted plants'), '40');
    await user.selectOptions(screen.getByLabelText('How sure'), '0.95');
    await user.selectOptions(screen.getByLabelText('Species', { selector: 'select' }), gooseberry.id);
    await screen.findByText('Checked by the Heelwood server.');
    const rate = strikeRateFor(gooseberry, 'none', { reports: 3, stuck: 120, rooted: 90 });
    const f = planFigures({ layout: { positions: 40 }, cuttingsPerPosition: 2, strikeRate: rate.rate, target: { rooted: 40, confidence: 0.95 } });
    expect(screen.getByTestId('plan-ask').textContent).toBe(whole(f.cuttingsForTarget!));
    expect(screen.getByText('Cuttings for 40 rooted plants, 95 % sure')).toBeTruthy();
  });

  it('names a wrong field with the shared rule’s message', async () => {
    const user = userEvent.setup();
    renderPlanner();
    const spacing = screen.getByLabelText('Spacing (m)');
    await user.clear(spacing);
    await user.type(spacing, '40');
    expect(await screen.findAllByText('Spacing is longer than the row')).not.toHaveLength(0);
    expect(spacing.getAttribute('aria-invalid')).toBe('true');
  });

  it('shows the guidance of shared/planner.ts for the hemisphere, the season and the species', async () => {
    const user = userEvent.setup();
    renderPlanner();
    await user.selectOptions(screen.getByLabelText('Species', { selector: 'select' }), gooseberry.id);
    expect(screen.getByText(shadeSideGuidance('south').text)).toBeTruthy();
    expect(screen.getByText('Gooseberry tolerates shade: the south side of the trees suits it.')).toBeTruthy();
    for (const line of seasonGuidance('dormant_hardwood')) expect(screen.getByText(line)).toBeTruthy();
    for (const line of safetyCautions({ hormone: false, restrictionNote: gooseberry.restrictionNote })) expect(screen.getByText(line)).toBeTruthy();
    await user.selectOptions(screen.getByLabelText('Treatment before sticking'), 'hormone');
    expect(screen.getByText(/^Rooting hormone: wear gloves/)).toBeTruthy();
  });

  it('carries species, treatment, cuttings and the plan into the request', async () => {
    const user = userEvent.setup();
    const { onAddToRequest } = renderPlanner();
    await user.selectOptions(screen.getByLabelText('Species', { selector: 'select' }), gooseberry.id);
    await user.selectOptions(screen.getByLabelText('Variety'), gooseberry.varieties[0].id);
    await user.selectOptions(screen.getByLabelText('Treatment before sticking'), 'willow');
    await screen.findByText('Checked by the Heelwood server.');
    await user.click(screen.getByRole('button', { name: 'Add to my request' }));
    expect(onAddToRequest).toHaveBeenCalledWith('s1', {
      speciesId: gooseberry.id,
      varietyId: gooseberry.varieties[0].id,
      treatment: 'willow',
      cuttings: 52,
      plan: JSON.stringify({ kind: 'hedgerow', lengthM: 30, spacingM: 1.2, rows: 1, positions: 26, cuttingsPerPosition: 2 }),
    });
  });
});
