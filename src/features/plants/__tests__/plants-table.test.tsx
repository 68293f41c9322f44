// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { PlantListItem } from '../../../../shared/schemas/register';
import { activeFilterCount, exportCsvHref, plantParamsToSearch, readPlantParams } from '../api/plant-params';
import { PlantsTable } from '../components/plants-table';

afterEach(cleanup);

const plant = (over: Partial<PlantListItem>): PlantListItem => ({
  id: 'p1',
  code: 'WTH-0001',
  farmId: 'f1',
  farmName: 'Wetherstone Farm',
  farmCode: 'WTH',
  speciesId: 's1',
  speciesName: 'Blackcurrant',
  scientificName: 'Ribes nigrum',
  varietyId: null,
  varietyName: 'Ledbury Sable',
  plantingYear: 2019,
  role: 'stock_bed',
  provenance: 'bought',
  healthStatus: 'clean',
  lastInspectedOn: '2026-10-01',
  lat: null,
  lon: null,
  bedRow: null,
  full: true,
  ...over,
});

function renderTable(over: Partial<Parameters<typeof PlantsTable>[0]> = {}) {
  const props = {
    plants: [plant({}), plant({ id: 'p2', code: 'WTH-0002', healthStatus: 'hold', lastInspectedOn: null })],
    total: 120,
    page: 1,
    pageSize: 25,
    sort: 'code' as const,
    dir: 'asc' as const,
    selection: {},
    onSelectionChange: vi.fn(),
    onPageChange: vi.fn(),
    onSortChange: vi.fn(),
    plantHref: (id: string) => `/plants/${id}`,
    ...over,
  };
  render(
    <MemoryRouter>
      <PlantsTable {...props} />
    </MemoryRouter>,
  );
  return props;
}

describe('PlantsTable', () => {
  it('shows health as words with a shape, links each code to its page, and counts pages from the server total', () => {
    renderTable();
    const table = screen.getByRole('table', { name: 'Mother plants' });
    expect(within(table).getByRole('link', { name: 'WTH-0002' }).getAttribute('href')).toBe('/plants/p2');
    const hold = within(table).getByText('Hold');
    expect(hold.parentElement?.querySelector('svg')?.getAttribute('data-shape')).toBe('octagon');
    expect(within(table).getByText('Never')).toBeTruthy();
    expect(screen.getByText(/Page 1 of 5/)).toBeTruthy();
  });

  it('asks the server to sort: a sorted column turns around, another column starts ascending', async () => {
    const user = userEvent.setup();
    const props = renderTable();
    const table = screen.getByRole('table', { name: 'Mother plants' });
    expect(within(table).getByRole('columnheader', { name: /Code/ }).getAttribute('aria-sort')).toBe('ascending');
    await user.click(within(table).getByRole('button', { name: /^Code/ }));
    expect(props.onSortChange).toHaveBeenLastCalledWith('code', 'desc');
    await user.click(within(table).getByRole('button', { name: /^Planted/ }));
    expect(props.onSortChange).toHaveBeenLastCalledWith('plantingYear', 'asc');
  });

  it('chooses plants for labels and pages through the server', async () => {
    const user = userEvent.setup();
    const props = renderTable();
    const table = screen.getByRole('table', { name: 'Mother plants' });
    await user.click(within(table).getByRole('checkbox', { name: 'Select WTH-0002' }));
    expect(props.onSelectionChange).toHaveBeenCalledWith({ p2: true });
    await user.click(screen.getByRole('button', { name: 'Next' }));
    expect(props.onPageChange).toHaveBeenCalledWith(2);
  });
});

describe('plant list parameters', () => {
  it('read from and write to the address, dropping defaults and nonsense', () => {
    const params = readPlantParams(
      new URLSearchParams('q=sable&status=hold,watch,bogus&role=stock_bed&yearFrom=2015&yearTo=20&inspected=stale&mine=true&sort=farm&dir=desc&page=3&pageSize=50&farmId=x'),
    );
    expect(params).toMatchObject({ q: 'sable', status: ['hold', 'watch'], role: 'stock_bed', yearFrom: 2015, yearTo: undefined, inspected: 'stale', mine: true, sort: 'farm', dir: 'desc', page: 3, pageSize: 50, farmId: undefined });
    expect(activeFilterCount(params)).toBe(6);
    expect(plantParamsToSearch(params).toString()).toBe('q=sable&status=hold%2Cwatch&role=stock_bed&yearFrom=2015&inspected=stale&mine=true&sort=farm&dir=desc&page=3&pageSize=50');
    expect(exportCsvHref(params)).toBe('/api/mother-plants/export.csv?q=sable&status=hold%2Cwatch&role=stock_bed&yearFrom=2015&inspected=stale&mine=true&sort=farm&dir=desc');
    expect(plantParamsToSearch(readPlantParams(new URLSearchParams(''))).toString()).toBe('');
  });
});
