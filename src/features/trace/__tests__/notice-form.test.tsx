// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Exposure, ExposureFinding, NoticeOutcome } from '../../../../shared/schemas/trace';
import { ExposureView } from '../components/exposure-view';
import { NoticeForm } from '../components/notice-form';

const finding: ExposureFinding = {
  id: '11111111-1111-4111-8111-111111111111',
  inspectionId: 'i1',
  inspectedOn: '2026-11-04',
  severity: 'moderate',
  notes: 'Several swollen round buds on the lower shoots.',
  pest: {
    id: 'p1',
    code: 'BBM',
    name: 'Big bud mite',
    scientificName: 'Cecidophyopsis ribis',
    signs: 'Swollen, round buds in winter that fail to open in spring.',
    advice: 'Reject any wood with swollen round buds.',
  },
};

const exposure = (notified: [boolean, boolean]): Exposure => ({
  plant: { id: 'plant-1', code: 'ARB-0008', farmName: 'Arrowbank Nursery', speciesName: 'Blackcurrant', varietyName: 'Hollow Lane', healthStatus: 'hold' },
  finding,
  since: '2025-09-15',
  rule: 'Wood that may carry the finding: every bundle collected on or after the last clean inspection.',
  bundles: [
    { id: 'b1', code: 'B25-0031', status: 'collected', cuttings: 30, collectedAt: '2026-01-10T10:00:00Z', collectedOn: '2026-01-10', seasonName: 'Dormant hardwood 2025–26', fromPlantId: 'plant-1', fromPlantCode: 'ARB-0008', farmName: 'Arrowbank Nursery', growerId: 'g1', growerName: 'Hugh Lacey' },
    { id: 'b2', code: 'B25-0032', status: 'collected', cuttings: 12, collectedAt: '2026-01-11T10:00:00Z', collectedOn: '2026-01-11', seasonName: 'Dormant hardwood 2025–26', fromPlantId: 'plant-1', fromPlantCode: 'ARB-0008', farmName: 'Arrowbank Nursery', growerId: 'g2', growerName: 'Owen Vaughan' },
  ],
  plants: [{ id: 'plant-2', code: 'LYN-0040', farmName: 'Lynchet Orchard', healthStatus: 'clean', depth: 1, sourceBundleCode: 'B25-0032' }],
  growers: [
    { id: 'g1', name: 'Hugh Lacey', email: 'hugh@heelwood.test', bundles: ['B25-0031'], notified: notified[0] },
    { id: 'g2', name: 'Owen Vaughan', email: 'owen@heelwood.test', bundles: ['B25-0032'], notified: notified[1] },
  ],
  pending: [],
});

const fetchMock = vi.fn<typeof fetch>();
const json = (body: unknown, status = 200) => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
beforeEach(() => vi.stubGlobal('fetch', fetchMock));
afterEach(() => {
  cleanup();
  fetchMock.mockReset();
  vi.unstubAllGlobals();
});

function renderForm(x: Exposure) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <MemoryRouter>
        <NoticeForm plantId="plant-1" exposure={x} finding={finding} signedBy="Rhiannon Price" />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

function posts() {
  return fetchMock.mock.calls.filter(([, init]) => init?.method === 'POST');
}

describe('NoticeForm', () => {
  it('starts with a sensible note, outlines the notice, asks first, then sends and shows what the server did', async () => {
    const outcome: NoticeOutcome = { sent: 2, duplicate: 0, failed: 0, recipients: 2 };
    fetchMock.mockImplementation(async () => json(outcome));
    renderForm(exposure([false, false]));

    const note = screen.getByLabelText(/Note from the coordinator/) as HTMLTextAreaElement;
    expect(note.value).toMatch(/keep them apart from your other stock/);
    expect(note.value).toMatch(/local plant-health authority/);
    expect(note.value).toMatch(/Rhiannon Price, coordinator$/);
    const outline = screen.getByRole('group', { name: 'What each grower receives' });
    expect(outline.textContent).toMatch(/Plant-health notice: Big bud mite on a plant your wood came from/);
    expect(outline.textContent).toMatch(/Swollen, round buds in winter/);
    expect(outline.textContent).toMatch(/Contact the local plant-health authority/);

    await userEvent.clear(note);
    await userEvent.type(note, 'Check your cuttings this week.');
    expect(outline.textContent).toMatch(/Your noteCheck your cuttings this week\./);
    await userEvent.click(screen.getByRole('button', { name: 'Review and send the notice' }));
    // Nothing goes before the confirm step.
    expect(posts()).toHaveLength(0);
    const dialog = screen.getByRole('dialog', { name: 'Send the plant-health notice?' });
    expect(within(dialog).getAllByRole('listitem').map((li) => li.textContent)).toEqual(['Hugh Lacey (hugh@heelwood.test)', 'Owen Vaughan (owen@heelwood.test)']);
    await userEvent.click(within(dialog).getByRole('button', { name: 'Yes, send the notice' }));

    await screen.findByText('Notice sent to 2 growers');
    const [url, init] = posts()[0];
    expect(url).toBe('/api/mother-plants/plant-1/notices');
    expect(JSON.parse(String(init?.body))).toEqual({ findingId: finding.id, note: 'Check your cuttings this week.' });
    expect(screen.getByTestId('notice-outcome').textContent).toMatch(/^Sent now: 2\./);
  });

  it('says plainly that a second send e-mails nobody', async () => {
    fetchMock.mockImplementation(async () => json({ sent: 0, duplicate: 2, failed: 0, recipients: 2 } satisfies NoticeOutcome));
    renderForm(exposure([true, true]));
    expect(screen.getByText(/Every one of the 2 growers has had this notice\. Sending again e-mails nobody/)).toBeTruthy();
    await userEvent.click(screen.getByRole('button', { name: 'Review and send the notice' }));
    const dialog = screen.getByRole('dialog', { name: 'Send the plant-health notice?' });
    expect(within(dialog).getByText(/nobody will be e-mailed again/)).toBeTruthy();
    await userEvent.click(within(dialog).getByRole('button', { name: 'Yes, send the notice' }));
    await screen.findByText('Nothing new was sent');
    expect(screen.getByTestId('notice-outcome').textContent).toMatch(/Every one of the 2 growers already had this notice for this finding/);
  });

  it('refuses a note over 1,000 characters, naming the field, and sends nothing', async () => {
    renderForm(exposure([false, false]));
    const note = screen.getByLabelText(/Note from the coordinator/);
    await userEvent.clear(note);
    await userEvent.click(note);
    await userEvent.paste('x'.repeat(1001));
    await userEvent.click(screen.getByRole('button', { name: 'Review and send the notice' }));
    expect(await screen.findByText('The note is at most 1,000 characters')).toBeTruthy();
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(fetchMock).not.toHaveBeenCalled();
  });
});

describe('ExposureView', () => {
  it('shows the finding, the day of the last clean inspection, the wood, the plants raised and who was notified', () => {
    render(
      <MemoryRouter>
        <ExposureView exposure={exposure([true, false])} finding={finding} />
      </MemoryRouter>,
    );
    expect(screen.getByText(/Big bud mite \(Cecidophyopsis ribis\)/)).toBeTruthy();
    expect(screen.getByText('15 Sep 2025')).toBeTruthy();
    const bundles = screen.getByRole('table', { name: 'Bundles collected since the last clean inspection' });
    expect(within(bundles).getAllByTestId('exposed-bundle').map((r) => r.querySelector('td')?.textContent)).toEqual(['B25-0031', 'B25-0032']);
    expect(screen.getByRole('link', { name: 'LYN-0040' }).getAttribute('href')).toBe('/plants/plant-2');
    expect(screen.getByTestId('exposed-plant').textContent).toMatch(/child of ARB-0008 · from bundle B25-0032/);
    const growers = screen.getAllByTestId('exposed-grower');
    expect(within(growers[0]).getByText('Notice sent')).toBeTruthy();
    expect(within(growers[1]).getByText('Not notified yet')).toBeTruthy();
  });
});
