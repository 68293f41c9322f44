// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Pest } from '../../../../shared/schemas/health';
import { describeOutcome, InspectionForm } from '../components/inspection-form';

const pest = (over: Partial<Pest>): Pest => ({
  id: '00000000-0000-4000-8000-000000000000',
  code: 'x',
  name: 'x',
  scientificName: null,
  kind: 'pest',
  travelsInWood: false,
  genera: [],
  signs: '',
  advice: '',
  source: '',
  ...over,
});

const BIG_BUD = pest({ id: '11111111-1111-4111-8111-111111111111', code: 'bbm', name: 'Big bud mite', travelsInWood: true, genera: ['Ribes'], signs: 'Swollen round buds.' });
const SAWFLY = pest({ id: '22222222-2222-4222-8222-222222222222', code: 'nem', name: 'Gooseberry sawfly', genera: ['Ribes'] });
const FANLEAF = pest({ id: '33333333-3333-4333-8333-333333333333', code: 'gflv', name: 'Grapevine fanleaf virus', travelsInWood: true, genera: ['Vitis'] });
const APHID = pest({ id: '44444444-4444-4444-8444-444444444444', code: 'aph', name: 'Aphids (any)', genera: [] });

const PLANT_ID = '99999999-9999-4999-8999-999999999999';
const fetchMock = vi.fn<typeof fetch>();

beforeEach(() => vi.stubGlobal('fetch', fetchMock));
afterEach(() => {
  cleanup();
  fetchMock.mockReset();
  vi.unstubAllGlobals();
});

function renderForm() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <InspectionForm plantId={PLANT_ID} plantCode="WTH-0042" genus="Ribes" currentStatus="clean" pests={[BIG_BUD, SAWFLY, FANLEAF, APHID]} />
    </QueryClientProvider>,
  );
}

describe('InspectionForm', () => {
  it('adds and removes finding rows, offering only pests of the plant’s genus or of any genus', async () => {
    const user = userEvent.setup();
    renderForm();
    expect(screen.queryAllByTestId('finding-row')).toHaveLength(0);
    expect(screen.getByText(/No findings: the plant will be recorded as clean/)).toBeTruthy();

    await user.click(screen.getByRole('button', { name: 'Add a finding' }));
    await user.click(screen.getByRole('button', { name: 'Add a finding' }));
    const rows = screen.getAllByTestId('finding-row');
    expect(rows).toHaveLength(2);

    const options = within(rows[0]).getAllByRole('option').map((o) => o.textContent);
    expect(options).toContain('Big bud mite (travels in cutting wood)');
    expect(options).toContain('Gooseberry sawfly');
    expect(options).toContain('Aphids (any)');
    expect(options.some((o) => o?.includes('Grapevine'))).toBe(false);

    await user.click(within(rows[1]).getByRole('button', { name: 'Remove finding 2' }));
    expect(screen.getAllByTestId('finding-row')).toHaveLength(1);
  });

  it('names the field of each row that is not filled in, and sends nothing', async () => {
    const user = userEvent.setup();
    renderForm();
    await user.click(screen.getByRole('button', { name: 'Add a finding' }));
    await user.click(screen.getByRole('button', { name: 'Save the inspection' }));

    expect(await screen.findByText('Pest or disease: choose one from the list')).toBeTruthy();
    expect(screen.getByText('Severity: choose minor, moderate or severe')).toBeTruthy();
    expect(screen.getByLabelText('Pest or disease').getAttribute('aria-invalid')).toBe('true');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('shows that a finding travelling in wood will put the plant on hold, sends the inspection, and says what happened', async () => {
    fetchMock.mockResolvedValueOnce(
      new Response(
        JSON.stringify({
          inspection: { id: 'i1', inspectedOn: '2027-01-10' },
          statusBefore: 'clean',
          statusAfter: 'hold',
          rule: 'A finding travels in cutting wood (any severity)',
          withdrawnOffers: 1,
        }),
        { status: 201 },
      ),
    );
    const user = userEvent.setup();
    renderForm();
    await user.click(screen.getByRole('button', { name: 'Add a finding' }));
    await user.selectOptions(screen.getByLabelText('Pest or disease'), BIG_BUD.id);
    await user.selectOptions(screen.getByLabelText('Severity'), 'moderate');
    expect(screen.getByText('When saved, this plant will be')).toBeTruthy();
    expect(screen.getAllByText('Travels in cutting wood').length).toBeGreaterThan(0);

    await user.click(screen.getByRole('button', { name: 'Save the inspection' }));

    expect(await screen.findByText('Put on hold: a finding that travels in cutting wood')).toBeTruthy();
    expect(screen.getByText(/1 open wood offer was withdrawn/)).toBeTruthy();
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe(`/api/mother-plants/${PLANT_ID}/inspections`);
    expect(init?.method).toBe('POST');
    const body = JSON.parse(String(init?.body));
    expect(body.findings).toEqual([{ pestId: BIG_BUD.id, severity: 'moderate', notes: '' }]);
    expect(body.inspectedOn).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    // The form is ready for the next inspection.
    expect(screen.queryAllByTestId('finding-row')).toHaveLength(0);
  });

  it('puts the server’s per-row message on that row’s field, naming it', async () => {
    fetchMock.mockResolvedValueOnce(
      new Response(
        JSON.stringify({ error: { code: 'invalid_input', message: 'A finding does not apply to this species.', fields: { 'findings.0.pestId': 'does not affect Ribes' } } }),
        { status: 400 },
      ),
    );
    const user = userEvent.setup();
    renderForm();
    await user.click(screen.getByRole('button', { name: 'Add a finding' }));
    await user.selectOptions(screen.getByLabelText('Pest or disease'), SAWFLY.id);
    await user.selectOptions(screen.getByLabelText('Severity'), 'minor');
    await user.click(screen.getByRole('button', { name: 'Save the inspection' }));

    expect(await screen.findByText('Pest or disease: does not affect Ribes')).toBeTruthy();
    expect(screen.getByText('A finding does not apply to this species.')).toBeTruthy();
    expect(screen.getAllByTestId('finding-row')).toHaveLength(1);
  });
});

describe('describeOutcome', () => {
  it('says plainly what an inspection did to the status', () => {
    expect(describeOutcome({ statusBefore: 'clean', statusAfter: 'watch', rule: 'x', withdrawnOffers: 0 }).title).toBe(
      'Put on watch: a finding that does not travel in wood',
    );
    expect(describeOutcome({ statusBefore: 'watch', statusAfter: 'clean', rule: 'x', withdrawnOffers: 0 }).title).toBe('Clean again');
    expect(describeOutcome({ statusBefore: 'hold', statusAfter: 'hold', rule: 'x', withdrawnOffers: 0 }).title).toBe('Still on hold');
  });
});
