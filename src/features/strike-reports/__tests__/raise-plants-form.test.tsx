// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { MyBundles } from '../../../../shared/schemas/strike-reports';
import { RaisePlantsForm, type RaiseFormBundle } from '../components/raise-plants-form';

// 7 of 9 cuttings rooted, 1 plant already registered: 6 more may be.
const bundle: RaiseFormBundle = {
  id: 'b1',
  code: 'B25-0007',
  plant: { code: 'ARB-0012' },
  farm: { name: 'Arrowbank Nursery' },
  reports: [{ id: 'r1', bundleId: 'b1', stuck: 9, rooted: 7, assessedOn: '2026-09-15', treatment: 'willow', notes: '', reporterName: 'Kasia Nowak', createdAt: '2026-09-15T10:00:00Z', mine: true, photos: [] }],
  reported: { stuck: 9, rooted: 7 },
  raisedPlants: [{ id: 'p0', code: 'WTH-0040', farmName: 'Wetherstone Farm' }],
  mayRaise: 6,
  collectedOn: '2025-12-13',
};
const farms: MyBundles['farms'] = [
  { id: '11111111-1111-4111-8111-111111111111', name: 'Wetherstone Farm', code: 'WTH', farmRole: 'hand' },
  { id: '22222222-2222-4222-8222-222222222222', name: 'Hope Orchard', code: 'HOP', farmRole: 'lead' },
];

const fetchMock = vi.fn<typeof fetch>();
beforeEach(() => vi.stubGlobal('fetch', fetchMock));
afterEach(() => {
  cleanup();
  fetchMock.mockReset();
  vi.unstubAllGlobals();
});

function renderForm(b: RaiseFormBundle = bundle) {
  const onRaised = vi.fn();
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <RaisePlantsForm bundle={b} farms={farms} thisYear={2026} onRaised={onRaised} />
    </QueryClientProvider>,
  );
  return { onRaised, user: userEvent.setup() };
}

function errorBeside(label: string): string {
  const control = screen.getByLabelText(label, { exact: false });
  const ids = (control.getAttribute('aria-describedby') ?? '').split(' ').filter((id) => id.endsWith('-error'));
  return ids.map((id) => document.getElementById(id)?.textContent ?? '').join(' ');
}

async function fill(user: ReturnType<typeof userEvent.setup>, label: string, value: string) {
  const box = screen.getByLabelText(label, { exact: false });
  await user.clear(box);
  if (value) await user.type(box, value);
}

const submit = (user: ReturnType<typeof userEvent.setup>) => user.click(screen.getByRole('button', { name: 'Register the plants' }));

describe('RaisePlantsForm', () => {
  it('asks for a farm and a role, and keeps to the rooted cuttings not yet registered', async () => {
    const { user } = renderForm();
    expect((screen.getByLabelText('Number of plants', { exact: false }) as HTMLInputElement).value).toBe('6');
    await fill(user, 'Number of plants', '7');
    await fill(user, 'Planting year', '2024');
    await submit(user);
    await waitFor(() => expect(errorBeside('Role')).toMatch(/Role must be stock bed or fruiting bush/));
    expect(errorBeside('Farm')).toMatch(/Farm: choose one from the list/);
    await user.selectOptions(screen.getByLabelText('Farm', { exact: false }), farms[0].id);
    await user.selectOptions(screen.getByLabelText('Role', { exact: false }), 'stock_bed');
    await submit(user);
    await waitFor(() => expect(errorBeside('Number of plants')).toMatch(/At most 6: 7 rooted in the reports, 1 already registered/));
    expect(errorBeside('Planting year')).toMatch(/cannot be before the wood was collected \(2025\)/);
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('refuses before any report says how many rooted', async () => {
    const { user } = renderForm({ ...bundle, reports: [], reported: { stuck: 0, rooted: 0 }, raisedPlants: [], mayRaise: 0 });
    await user.selectOptions(screen.getByLabelText('Farm', { exact: false }), farms[1].id);
    await user.selectOptions(screen.getByLabelText('Role', { exact: false }), 'fruiting_bush');
    await fill(user, 'Number of plants', '1');
    await submit(user);
    await waitFor(() => expect(errorBeside('Number of plants')).toMatch(/Report how many cuttings rooted first/));
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('registers the plants and shows a server refusal beside the farm', async () => {
    fetchMock.mockResolvedValueOnce(
      new Response(JSON.stringify({ error: { code: 'BAD_REQUEST', message: 'Plants raised from a bundle go on a farm where its grower is farm lead or farm hand.', fields: { farmId: 'the grower does not work on this farm' } } }), {
        status: 400,
      }),
    );
    const { user, onRaised } = renderForm();
    await user.selectOptions(screen.getByLabelText('Farm', { exact: false }), farms[1].id);
    await user.selectOptions(screen.getByLabelText('Role', { exact: false }), 'stock_bed');
    await fill(user, 'Number of plants', '2');
    await fill(user, 'Bed / row', 'Nursery row 3');
    await submit(user);
    await waitFor(() => expect(errorBeside('Farm')).toMatch(/Farm: the grower does not work on this farm/));
    expect(onRaised).not.toHaveBeenCalled();
    expect(JSON.parse(String(fetchMock.mock.calls[0][1]?.body))).toEqual({ farmId: farms[1].id, count: 2, role: 'stock_bed', plantingYear: 2026, bedRow: 'Nursery row 3' });

    const made = [
      { id: 'p1', code: 'WTH-0041', farmId: farms[0].id, parentPlantId: 'src', sourceBundleId: 'b1' },
      { id: 'p2', code: 'WTH-0042', farmId: farms[0].id, parentPlantId: 'src', sourceBundleId: 'b1' },
    ];
    fetchMock.mockResolvedValueOnce(new Response(JSON.stringify({ items: made, total: 2 }), { status: 201 }));
    await user.selectOptions(screen.getByLabelText('Farm', { exact: false }), farms[0].id);
    await submit(user);
    await waitFor(() => expect(onRaised).toHaveBeenCalledWith(made));
    const [url, init] = fetchMock.mock.calls[1];
    expect(url).toBe('/api/bundles/b1/raise-plants');
    expect(JSON.parse(String(init?.body))).toMatchObject({ farmId: farms[0].id, count: 2 });
  });
});
