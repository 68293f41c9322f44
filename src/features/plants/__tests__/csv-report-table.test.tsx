// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { PLANT_CSV_COLUMNS } from '../../../../shared/schemas/plants-csv';
import { CsvColumns } from '../components/csv-import';
import { CsvReportTable, REPORT_ROWS_SHOWN } from '../components/csv-report-table';

afterEach(cleanup);

describe('CsvReportTable', () => {
  it('lists each problem by row, column and reason, in row order', () => {
    render(
      <CsvReportTable
        caption="Problems in the file"
        problems={[
          { row: 7, column: 'planting_year', message: 'Planting year must be a whole year like 2019' },
          { row: 3, column: 'farm', message: 'No farm has the code XYZ' },
          { row: 3, column: null, message: 'This row has more cells than the header has columns.' },
        ]}
      />,
    );
    const table = screen.getByRole('table', { name: 'Problems in the file' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(3);
    expect(within(rows[0]).getByText('3')).toBeTruthy();
    expect(within(rows[0]).getByText('whole row')).toBeTruthy();
    expect(within(rows[1]).getByText('farm')).toBeTruthy();
    expect(within(rows[1]).getByText('No farm has the code XYZ')).toBeTruthy();
    expect(within(rows[2]).getByText('7')).toBeTruthy();
    expect(within(rows[2]).getByText('planting_year')).toBeTruthy();
    expect(within(table).getAllByRole('columnheader').map((h) => h.textContent)).toEqual(['Row', 'Column', 'Why']);
  });

  it('shows the first rows of a very long report and says how many more there are', () => {
    const problems = Array.from({ length: REPORT_ROWS_SHOWN + 12 }, (_, i) => ({ row: i + 2, column: 'species', message: 'Species is required' }));
    render(<CsvReportTable caption="Problems" problems={problems} />);
    expect(within(screen.getByRole('table')).getAllByRole('row')).toHaveLength(REPORT_ROWS_SHOWN + 1);
    expect(screen.getByText(/And 12 more/)).toBeTruthy();
  });
});

describe('CsvColumns', () => {
  it('shows every column of the template, marking the required ones', () => {
    render(<CsvColumns />);
    for (const column of PLANT_CSV_COLUMNS) expect(screen.getByText(column)).toBeTruthy();
    expect(screen.getAllByText('required')).toHaveLength(5);
  });
});
