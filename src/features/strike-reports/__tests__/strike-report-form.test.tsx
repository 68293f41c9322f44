// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { StrikeReportForm, type ReportFormBundle } from '../components/strike-report-form';

// A bundle of 60 cuttings collected on 13 Dec 2025, 50 of them already in a report.
const bundle: ReportFormBundle = {
  id: 'b1',
  code: 'B25-0007',
  cuttings: 60,
  unreported: 10,
  reported: { stuck: 50, rooted: 40 },
  collectedOn: '2025-12-13',
  plannedTreatment: 'willow',
};
const TODAY = '2026-09-20';

const fetchMock = vi.fn<typeof fetch>();
beforeEach(() => vi.stubGlobal('fetch', fetchMock));
afterEach(() => {
  cleanup();
  fetchMock.mockReset();
  vi.unstubAllGlobals();
});

function renderForm(b: ReportFormBundle = bundle) {
  const onFiled = vi.fn();
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <StrikeReportForm bundle={b} today={TODAY} onFiled={onFiled} />
    </QueryClientProvider>,
  );
  return { onFiled, user: userEvent.setup() };
}

/** The control whose label starts with these words ("Rooted" is not "Photo of the rooted cuttings"; "Notes" may be "(optional)"). */
const control = (label: string) => screen.getByLabelText(new RegExp(`^${label.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`));

/** The message the Field shows beside a control (tied to it by aria-describedby). */
function errorBeside(label: string): string {
  const box = control(label);
  const ids = (box.getAttribute('aria-describedby') ?? '').split(' ').filter((id) => id.endsWith('-error'));
  return ids.map((id) => document.getElementById(id)?.textContent ?? '').join(' ');
}

async function fill(user: ReturnType<typeof userEvent.setup>, label: string, value: string) {
  const box = control(label);
  await user.clear(box);
  if (value) await user.type(box, value);
}

const submit = (user: ReturnType<typeof userEvent.setup>) => user.click(screen.getByRole('button', { name: 'File the strike report' }));

describe('StrikeReportForm', () => {
  it('starts from the cuttings not yet reported, today and the planned treatment', () => {
    renderForm();
    expect((screen.getByLabelText('Cuttings stuck', { exact: false }) as HTMLInputElement).value).toBe('10');
    expect((screen.getByLabelText('Date assessed', { exact: false }) as HTMLInputElement).value).toBe(TODAY);
    expect((screen.getByLabelText('Treatment', { exact: false }) as HTMLSelectElement).value).toBe('willow');
  });

  it('names the field when rooted is missing or more than stuck, and sends nothing', async () => {
    const { user } = renderForm();
    await submit(user);
    await waitFor(() => expect(errorBeside('Rooted')).toMatch(/Rooted must be a number/));

    await fill(user, 'Rooted', '11');
    await fill(user, 'Cuttings stuck', '8');
    await submit(user);
    await waitFor(() => expect(errorBeside('Rooted')).toMatch(/Rooted cannot be more than the cuttings stuck/));
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('keeps to the cuttings left in the bundle and to dates between collection and today', async () => {
    const { user } = renderForm();
    await fill(user, 'Cuttings stuck', '11');
    await fill(user, 'Rooted', '5');
    await submit(user);
    await waitFor(() => expect(errorBeside('Cuttings stuck')).toMatch(/At most 10: the bundle had 60 cuttings and 50 are already in a report/));

    await fill(user, 'Cuttings stuck', '10');
    await fill(user, 'Date assessed', '2025-12-12');
    await submit(user);
    await waitFor(() => expect(errorBeside('Date assessed')).toMatch(/before the bundle was collected \(2025-12-13\)/));
    expect(errorBeside('Cuttings stuck')).toBe('');

    await fill(user, 'Date assessed', '2026-09-21');
    await submit(user);
    await waitFor(() => expect(errorBeside('Date assessed')).toMatch(/Cannot be in the future/));

    await fill(user, 'Cuttings stuck', '0');
    await submit(user);
    await waitFor(() => expect(errorBeside('Cuttings stuck')).toMatch(/At least one cutting was stuck/));
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('sends a valid report and hands the filed report back', async () => {
    fetchMock.mockResolvedValueOnce(
      new Response(
        JSON.stringify({ id: 'r1', bundleId: 'b1', stuck: 9, rooted: 7, assessedOn: '2026-09-15', treatment: 'hormone', notes: 'Nursery bed', reporterName: 'Kasia Nowak', createdAt: '2026-09-20T10:00:00Z' }),
        { status: 201 },
      ),
    );
    const { user, onFiled } = renderForm();
    await fill(user, 'Cuttings stuck', '9');
    await fill(user, 'Rooted', '7');
    await fill(user, 'Date assessed', '2026-09-15');
    await user.selectOptions(screen.getByLabelText('Treatment', { exact: false }), 'hormone');
    // Rooting hormone: the caution shows beside the choice.
    expect(screen.getByText(/Rooting hormone: wear gloves, follow the directions on the label/)).toBeTruthy();
    await fill(user, 'Notes', 'Nursery bed');
    await submit(user);
    await waitFor(() => expect(onFiled).toHaveBeenCalledTimes(1));
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe('/api/bundles/b1/strike-reports');
    expect(init?.method).toBe('POST');
    expect(JSON.parse(String(init?.body))).toEqual({ stuck: 9, rooted: 7, assessedOn: '2026-09-15', treatment: 'hormone', notes: 'Nursery bed' });
    expect(onFiled.mock.calls[0][0]).toMatchObject({ id: 'r1', rooted: 7 });
  });

  it('puts a refusal from the server beside the field it names', async () => {
    fetchMock.mockResolvedValueOnce(
      new Response(JSON.stringify({ error: { code: 'BAD_REQUEST', message: 'Check the report.', fields: { stuck: 'At most 4: the bundle had 60 cuttings and 56 are already in a report' } } }), {
        status: 400,
      }),
    );
    const { user, onFiled } = renderForm();
    await fill(user, 'Rooted', '3');
    await submit(user);
    await waitFor(() => expect(errorBeside('Cuttings stuck')).toMatch(/At most 4: .* 56 are already in a report/));
    expect(screen.getByRole('alert').textContent).toMatch(/Check the report\./);
    expect(onFiled).not.toHaveBeenCalled();
  });

  describe('photo of the rooted cuttings', () => {
    const PHOTO = 'Photo of the rooted cuttings';
    const filed = { id: 'r1', bundleId: 'b1', stuck: 9, rooted: 7, assessedOn: '2026-09-15', treatment: 'willow', notes: '', reporterName: 'Sam Okafor', createdAt: '2026-09-20T10:00:00Z', mine: true, photos: [] };
    const stored = { photo: { id: 'p1', url: '/api/photos/p1/image', thumbUrl: '/api/photos/p1/thumb', caption: null, width: 64, height: 48, createdAt: '2026-09-20T10:00:01Z' } };
    const json = (body: unknown, status: number) => new Response(JSON.stringify(body), { status });
    const jpeg = () => new File([new Uint8Array([0xff, 0xd8, 0xff, 0xe0])], 'roots.jpg', { type: 'image/jpeg' });
    const photoInput = () => control(PHOTO) as HTMLInputElement;

    async function fillReport(user: ReturnType<typeof userEvent.setup>) {
      await fill(user, 'Cuttings stuck', '9');
      await fill(user, 'Rooted', '7');
      await fill(user, 'Date assessed', '2026-09-15');
    }

    it('offers JPEG, PNG and WebP, and refuses another type beside the field without filing anything', async () => {
      renderForm();
      expect(photoInput().accept).toBe('image/jpeg,image/png,image/webp');
      const user = userEvent.setup({ applyAccept: false });
      await fillReport(user);
      await user.upload(photoInput(), new File(['GIF89a'], 'roots.gif', { type: 'image/gif' }));
      await submit(user);
      await waitFor(() => expect(errorBeside(PHOTO)).toMatch(/Photo of the rooted cuttings: choose a JPEG, PNG or WebP image/));
      expect(fetchMock).not.toHaveBeenCalled();
    });

    it('refuses a photo over 10 MB (the server limit) before filing', async () => {
      const { user } = renderForm();
      await fillReport(user);
      await user.upload(photoInput(), new File([new Uint8Array(10 * 1024 * 1024 + 1)], 'big.jpg', { type: 'image/jpeg' }));
      await submit(user);
      await waitFor(() => expect(errorBeside(PHOTO)).toMatch(/larger than 10 MB/));
      expect(fetchMock).not.toHaveBeenCalled();
    });

    it('uploads the photo right after the report is filed, then hands the report back', async () => {
      fetchMock.mockResolvedValueOnce(json(filed, 201)).mockResolvedValueOnce(json(stored, 201));
      const { user, onFiled } = renderForm();
      await fillReport(user);
      const file = jpeg();
      await user.upload(photoInput(), file);
      await submit(user);
      await waitFor(() => expect(onFiled).toHaveBeenCalledTimes(1));
      expect(fetchMock.mock.calls.map(([url]) => url)).toEqual(['/api/bundles/b1/strike-reports', '/api/strike-reports/r1/photos']);
      const init = fetchMock.mock.calls[1][1]!;
      expect(init.method).toBe('POST');
      const form = init.body as FormData;
      expect(form.get('photo')).toBe(file);
      expect(onFiled.mock.calls[0][0]).toMatchObject({ id: 'r1' });
      // The form stays for the next report, without this one's photo.
      expect(photoInput().files?.length ?? 0).toBe(0);
    });

    it('keeps the report when the upload fails, says why beside the photo field, and tries again', async () => {
      fetchMock
        .mockResolvedValueOnce(json(filed, 201))
        .mockResolvedValueOnce(json({ error: { code: 'unsupported_image', message: 'The photo must be a JPEG, PNG or WebP image.', fields: { photo: 'not a JPEG, PNG or WebP image' } } }, 415));
      const { user, onFiled } = renderForm();
      await fillReport(user);
      await user.upload(photoInput(), jpeg());
      await submit(user);
      await waitFor(() => expect(errorBeside(PHOTO)).toMatch(/Photo of the rooted cuttings not uploaded: not a JPEG, PNG or WebP image/));
      expect(screen.getByText(/The report is saved/)).toBeTruthy();
      expect(onFiled).not.toHaveBeenCalled();
      expect(fetchMock).toHaveBeenCalledTimes(2);

      fetchMock.mockResolvedValueOnce(json(stored, 201));
      await user.upload(photoInput(), jpeg());
      await user.click(screen.getByRole('button', { name: 'Try the photo again' }));
      await waitFor(() => expect(onFiled).toHaveBeenCalledTimes(1));
      // The report is not filed a second time: only the photo is sent again.
      expect(fetchMock.mock.calls.map(([url]) => url)).toEqual(['/api/bundles/b1/strike-reports', '/api/strike-reports/r1/photos', '/api/strike-reports/r1/photos']);
    });

    it('sends the same photo again when none other is chosen (a dropped connection), and empties the field after', async () => {
      fetchMock.mockResolvedValueOnce(json(filed, 201)).mockRejectedValueOnce(new TypeError('Failed to fetch'));
      const { user, onFiled } = renderForm();
      await fillReport(user);
      const file = jpeg();
      await user.upload(photoInput(), file);
      await submit(user);
      await waitFor(() => expect(screen.getByText(/The report is saved/)).toBeTruthy());
      fetchMock.mockResolvedValueOnce(json(stored, 201));
      await user.click(screen.getByRole('button', { name: 'Try the photo again' }));
      await waitFor(() => expect(onFiled).toHaveBeenCalledTimes(1));
      expect((fetchMock.mock.calls[2][1]!.body as FormData).get('photo')).toBe(file);
      // Back on the form, the next report starts without this photo.
      expect(photoInput().files?.length ?? 0).toBe(0);
    });
  });
});
