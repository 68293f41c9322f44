// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { SeasonFigures } from '../../../../shared/schemas/figures';
import { FiguresView } from '../components/figures-view';
import { isEmpty, scopeSentence, speciesFigures, strikeBars } from '../lib/figures-rows';

// Charts measure their box; jsdom has no layout, so give them a fixed size to draw into.
beforeAll(() => {
  globalThis.ResizeObserver ??= class {
    constructor(private cb: ResizeObserverCallback) {}
    observe(target: Element) {
      this.cb([{ target, contentRect: { width: 640, height: 320 } } as unknown as ResizeObserverEntry], this as unknown as ResizeObserver);
    }
    unobserve() {}
    disconnect() {}
  } as unknown as typeof ResizeObserver;
});
afterEach(cleanup);

const zero = { offered: 0, asked: 0, allocated: 0, collected: 0, cancelled: 0 };
const row = (speciesId: string, speciesName: string, w: Partial<typeof zero>, varietyName: string | null = null) => ({
  speciesId,
  speciesName,
  varietyId: varietyName ? `${speciesId}-${varietyName}` : null,
  varietyName,
  ...zero,
  ...w,
});

const figures: SeasonFigures = {
  season: { id: 's1', name: 'Dormant hardwood 2025–26', kind: 'dormant_hardwood', hemisphere: 'north', stage: 'closed' },
  scope: 'cooperative',
  totals: { offered: 2232, asked: 462, allocated: 378, collected: 378, cancelled: 15 },
  bySpecies: [
    row('bc', 'Blackcurrant', { offered: 2066, asked: 312, allocated: 312, collected: 312 }),
    row('el', 'Elder', { offered: 166, asked: 150, allocated: 66, collected: 66, cancelled: 15 }),
    row('mu', 'Black mulberry', {}),
  ],
  byVariety: [row('bc', 'Blackcurrant', { asked: 154 }), row('bc', 'Blackcurrant', { offered: 2066, asked: 158, allocated: 312, collected: 312 }, 'Ledbury Sable'), row('el', 'Elder', { offered: 166, asked: 150, allocated: 66, collected: 66, cancelled: 15 }, 'Cordial Queen')],
  fill: { lines: 3, fullyMet: 1, partlyMet: 1, unmet: 1, meanRatio: 0.5, medianRatio: 0.5, minRatio: 0, overallRatio: 378 / 462 },
  lines: [
    { lineId: 'l1', growerName: 'Alice Meredith', speciesName: 'Elder', varietyName: 'Cordial Queen', asked: 100, allocated: 50, collected: 50, ratio: 0.5 },
    { lineId: 'l2', growerName: 'Ben Ashdown', speciesName: 'Blackcurrant', varietyName: null, asked: 312, allocated: 312, collected: 312, ratio: 1 },
    { lineId: 'l3', growerName: 'Cara Dunn', speciesName: 'Elder', varietyName: null, asked: 50, allocated: 16, collected: 16, ratio: 0.32 },
  ],
  travel: { bundles: 4, bundleKm: 61.5, growers: [{ growerId: 'g1', growerName: 'Alice Meredith', farms: 1, bundles: 2, roundTripKm: 21.5 }], roundTripKm: 21.5 },
  strikeRates: [
    { level: 'species', speciesId: 'bc', speciesName: 'Blackcurrant', varietyId: null, varietyName: null, treatment: 'willow', reports: 7, stuck: 225, rooted: 172, observed: 0.7644, rate: 0.7655, low: 0.7199, high: 0.8087 },
    { level: 'variety', speciesId: 'bc', speciesName: 'Blackcurrant', varietyId: 'v1', varietyName: 'Ledbury Sable', treatment: 'willow', reports: 2, stuck: 60, rooted: 50, observed: 0.8333, rate: 0.8, low: 0.7, high: 0.88 },
  ],
  raised: {
    valuePerPlant: 10,
    currency: 'GBP',
    rooted: 222,
    value: 2220,
    bySpecies: [{ speciesId: 'bc', speciesName: 'Blackcurrant', collectionYear: 2026, firstCropYears: 3, firstCropYear: 2029, rooted: 172, value: 1720 }],
    byFirstCropYear: [
      { year: 2028, rooted: 50, value: 500 },
      { year: 2029, rooted: 172, value: 1720 },
    ],
  },
};

describe('figures rows', () => {
  it('works out fill per species (allocated of asked) and leaves out species with nothing at all', () => {
    const rows = speciesFigures(figures);
    expect(rows.map((r) => [r.speciesName, r.fillRatio])).toEqual([
      ['Blackcurrant', 1],
      ['Elder', 66 / 150],
    ]);
  });

  it('turns species-level strike rates into bars with their 90 % interval as distances below and above', () => {
    const [bar] = strikeBars(figures);
    expect(strikeBars(figures)).toHaveLength(1);
    expect(bar.label).toBe('Blackcurrant · Willow soak');
    expect(bar.rate).toBeCloseTo(76.55, 2);
    expect(bar.interval[0]).toBeCloseTo(76.55 - 71.99, 2);
    expect(bar.interval[1]).toBeCloseTo(80.87 - 76.55, 2);
  });

  it("says whose figures these are", () => {
    expect(scopeSentence(figures, [])).toMatch(/^The whole cooperative's figures/);
    expect(scopeSentence({ ...figures, scope: 'member' }, ['Arrowbank Nursery'])).toBe(
      "Your own figures: the offers and bundles of your farm (Arrowbank Nursery), and your own wood requests and the bundles you received. The coordinator sees the whole cooperative's.",
    );
    expect(scopeSentence({ ...figures, scope: 'member' }, [])).toMatch(/^Your own figures: your own wood requests/);
  });
});

describe('FiguresView', () => {
  it('puts every chart in a captioned figure with its table, and the numbers in the tables', () => {
    render(<FiguresView figures={figures} />);
    const charts = screen.getAllByTestId('chart');
    expect(charts).toHaveLength(4);
    for (const chart of charts) {
      expect(chart.tagName).toBe('FIGURE');
      expect(chart.querySelector('figcaption')?.textContent?.length).toBeGreaterThan(20);
    }
    expect(screen.getByRole('figure', { name: /In all: 2,232 offered, 462 asked, 378 allocated, 378 collected/ })).toBeTruthy();

    const species = screen.getByRole('table', { name: 'Cuttings by species' });
    const elder = within(species).getByRole('rowheader', { name: 'Elder' }).closest('tr')!;
    // 66 allocated of 150 asked = 44 %.
    expect(within(elder).getAllByRole('cell').map((c) => c.textContent)).toEqual(['166', '150', '66', '66', '44 %']);
    const all = within(species).getByRole('rowheader', { name: 'All species' }).closest('tr')!;
    // 378 of 462 = 81.8 %.
    expect(within(all).getAllByRole('cell').map((c) => c.textContent)).toEqual(['2,232', '462', '378', '378', '82 %']);
    expect(within(species).queryByRole('rowheader', { name: 'Black mulberry' })).toBeNull();

    const lines = screen.getByRole('table', { name: 'Request lines and how they were filled' });
    expect(within(lines).getAllByRole('row').slice(1).map((r) => r.querySelector('td')?.textContent)).toEqual(['Cara Dunn', 'Alice Meredith', 'Ben Ashdown']);

    const strike = screen.getByRole('table', { name: 'Strike rates by species, variety and treatment' });
    expect(within(strike).getAllByRole('row')[1].textContent).toMatch(/Blackcurrantall varietiesWillow soak7172 of 22577 %72 % – 81 %/);
    expect(screen.getByText(/222 plants raised/).textContent).toMatch(/£2,220 at £10/);
    expect(screen.getByRole('table', { name: 'Round trips per grower' }).textContent).toMatch(/Alice Meredith1221\.5 km/);
  });

  it('draws the charts as SVG', () => {
    const { container } = render(<FiguresView figures={figures} />);
    expect(container.querySelectorAll('figure .recharts-wrapper > svg.recharts-surface').length).toBe(4);
    // Wood: four bars (offered, asked, allocated, collected) for each of the two species with wood.
    const wood = screen.getByRole('figure', { name: /In all: 2,232 offered/ });
    expect(wood.querySelectorAll('.recharts-bar-rectangle').length).toBe(8);
    expect([...wood.querySelectorAll('.recharts-legend-item-text')].map((t) => t.textContent)).toEqual(['Offered', 'Asked', 'Allocated', 'Collected']);
    // Fill: one bar per species asked for, in the chart's own colour (a data key named "fill" would repaint it).
    const fill = screen.getByRole('figure', { name: /Share of the cuttings asked that were allocated/ });
    const bars = [...fill.querySelectorAll('.recharts-bar-rectangle path')];
    expect(bars).toHaveLength(2);
    for (const bar of bars) expect(bar.getAttribute('fill')).toBe('#6a1f48');
  });

  it('says what to do when the season has nothing yet', () => {
    const empty: SeasonFigures = {
      ...figures,
      totals: zero,
      bySpecies: [],
      byVariety: [],
      lines: [],
      fill: { lines: 0, fullyMet: 0, partlyMet: 0, unmet: 0, meanRatio: null, medianRatio: null, minRatio: null, overallRatio: null },
      raised: { ...figures.raised, rooted: 0, value: 0, bySpecies: [], byFirstCropYear: [] },
    };
    expect(isEmpty(empty)).toBe(true);
    render(<FiguresView figures={empty} />);
    expect(screen.getByText('No figures for this season yet')).toBeTruthy();
    expect(screen.queryAllByTestId('chart')).toHaveLength(0);
  });
});
