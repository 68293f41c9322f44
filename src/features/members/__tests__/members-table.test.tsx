// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Member } from '../../../../shared/schemas/members';
import { MembersTable } from '../components/members-table';
import { MembersTableContext } from '../components/members-context';

const pending: Member = {
  id: 'u-pending',
  name: 'Ada Ash',
  email: 'ada@example.org',
  role: 'member',
  status: 'pending',
  placeName: 'Lower Field',
  application: 'A blackcurrant hedgerow along the lane.',
  createdAt: '2027-02-01T10:00:00.000Z',
  farms: [],
};

const active: Member = {
  id: 'u-active',
  name: 'Ben Birch',
  email: 'ben@example.org',
  role: 'member',
  status: 'active',
  placeName: null,
  application: null,
  createdAt: '2026-11-12T10:00:00.000Z',
  farms: [{ farmId: 'f1', farmName: 'Hollow Farm', farmCode: 'HOL', farmRole: 'lead' }],
};

const fetchMock = vi.fn<typeof fetch>();

beforeEach(() => vi.stubGlobal('fetch', fetchMock));
afterEach(() => {
  cleanup();
  fetchMock.mockReset();
  vi.unstubAllGlobals();
});

function renderTable(members: Member[], onPageChange = vi.fn()) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <MembersTableContext.Provider value={{ currentUserId: 'u-coordinator', farms: [], farmsUnavailable: null }}>
        <MembersTable
          members={members}
          total={60}
          page={1}
          pageSize={25}
          onPageChange={onPageChange}
          emptyMessage={{ title: 'No members yet', body: 'Share the sign-up page.' }}
        />
      </MembersTableContext.Provider>
    </QueryClientProvider>,
  );
  return { onPageChange };
}

describe('MembersTable', () => {
  it('lists members with status words, farms and the application note of a pending member', () => {
    renderTable([pending, active]);
    const table = screen.getByRole('table');
    expect(within(table).getByText('Ada Ash')).toBeTruthy();
    expect(within(table).getByText('Awaiting admission')).toBeTruthy();
    expect(within(table).getByText('Admitted')).toBeTruthy();
    expect(within(table).getByText('Hollow Farm')).toBeTruthy();
    expect(within(table).getByText('A blackcurrant hedgerow along the lane.')).toBeTruthy();
    expect(screen.getByText(/Page 1 of 3/)).toBeTruthy();
  });

  it('admits a pending member with PATCH status active', async () => {
    fetchMock.mockResolvedValueOnce(new Response(JSON.stringify({ ...pending, status: 'active' }), { status: 200 }));
    const user = userEvent.setup();
    renderTable([pending, active]);

    await user.click(screen.getByRole('button', { name: 'Admit' }));

    expect(fetchMock).toHaveBeenCalledTimes(1);
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe('/api/members/u-pending');
    expect(init?.method).toBe('PATCH');
    expect(JSON.parse(String(init?.body))).toEqual({ status: 'active' });
  });

  it('shows the server message when a change is refused', async () => {
    fetchMock.mockResolvedValueOnce(
      new Response(JSON.stringify({ error: { code: 'FORBIDDEN', message: 'Only a coordinator may admit members' } }), { status: 403 }),
    );
    const user = userEvent.setup();
    renderTable([pending]);
    await user.click(screen.getByRole('button', { name: 'Admit' }));
    expect(await screen.findByText('Only a coordinator may admit members')).toBeTruthy();
  });

  it('asks the server for the next page', async () => {
    const user = userEvent.setup();
    const { onPageChange } = renderTable([pending, active]);
    await user.click(screen.getByRole('button', { name: 'Next' }));
    expect(onPageChange).toHaveBeenCalledWith(2);
  });
});
