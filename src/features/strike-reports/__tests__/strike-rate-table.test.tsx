// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it } from 'vitest';
import type { StrikeRateRow } from '../../../../shared/schemas/strike-reports';
import { strikeRateFor } from '../../../../shared/strike-rate';
import { StrikeRateTable } from '../components/strike-rate-table';

afterEach(cleanup);

const currant = { strikeRatePrior: 0.7, priorStrength: 20 };
function row(varietyName: string | null, totals?: { reports: number; stuck: number; rooted: number }): StrikeRateRow {
  const est = strikeRateFor(currant, 'none', totals);
  return {
    speciesId: 's1',
    speciesName: 'Red currant',
    varietyId: varietyName ? `v-${varietyName}` : null,
    varietyName,
    level: varietyName ? 'variety' : 'species',
    treatment: 'none',
    prior: { untreated: 0.7, rate: 0.7, strength: 20 },
    reports: est.reports,
    stuck: est.stuck,
    rooted: est.rooted,
    rate: est.rate,
    low: est.low,
    high: est.high,
    source: est.source,
  };
}

const rows = [row(null, { reports: 2, stuck: 70, rooted: 50 }), row('Moonlace', { reports: 1, stuck: 50, rooted: 40 }), row('Lantern Row', { reports: 1, stuck: 20, rooted: 10 })];

describe('StrikeRateTable', () => {
  it('shows each estimate with its reference, reports and interval, and sorts by the mean', async () => {
    render(<StrikeRateTable rows={rows} methodsOf={() => 'Hardwood cuttings'} />);
    const body = screen.getAllByTestId('strike-rate-row');
    expect(within(body[0]).getByText('All varieties')).toBeTruthy();
    // Beta(14, 6) updated by 50 of 70: mean 64 / 90 (DESIGN.md, "Strike-rate estimate").
    expect(within(body[0]).getByTestId('rate-mean').textContent).toBe('71.1 %');
    expect(within(body[0]).getByText('(50 of 70 rooted)')).toBeTruthy();
    expect(within(body[0]).getByText('Hardwood cuttings')).toBeTruthy();
    expect(within(body[1]).getByTestId('rate-mean').textContent).toBe(`${((54 / 70) * 100).toFixed(1)} %`);

    await userEvent.setup().click(screen.getByRole('button', { name: /Posterior mean/ }));
    const sorted = screen.getAllByTestId('strike-rate-row').map((r) => r.getAttribute('data-variety'));
    expect(sorted).toEqual(['Moonlace', '', 'Lantern Row']);
  });
});
