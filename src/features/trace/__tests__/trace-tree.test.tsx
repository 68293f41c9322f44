// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it } from 'vitest';
import type { Trace, TraceNode } from '../../../../shared/schemas/trace';
import { TraceView } from '../components/trace-view';
import { buildTraceTree, generationLabel, traceRows, type TreeItem } from '../lib/trace-tree';

afterEach(cleanup);

function node(id: string, code: string, depth: number, parentId: string | null, extra: Partial<TraceNode> = {}): TraceNode {
  return {
    id,
    code,
    farmId: `farm-${code.slice(0, 3)}`,
    farmName: `${code.slice(0, 3)} Farm`,
    speciesName: 'Blackcurrant',
    varietyName: 'Ledbury Sable',
    healthStatus: 'clean',
    depth,
    parentId,
    via: parentId ? { bundleId: `b-${id}`, code: `B21-${id.padStart(4, '0')}`, seasonId: 's1', seasonName: 'Dormant hardwood 2021–22', growerName: `Grower ${id}` } : null,
    full: true,
    ...extra,
  };
}

// Grandparent 1 -> parent 2 -> traced plant 3 -> children 4 (ZZZ) and 5 (AAA); 4 -> grandchild 6;
// 7 is a grandchild whose parent is hidden from this person (the server sends parentId null).
const trace: Trace = {
  plant: node('3', 'LYN-0033', 0, '2'),
  ancestors: [node('2', 'ARB-0034', 1, '1'), node('1', 'WTH-0001', 2, null)],
  descendants: [
    node('4', 'ZZZ-0004', 1, '3'),
    node('5', 'AAA-0005', 1, '3', { healthStatus: 'hold' }),
    node('6', 'GRS-0006', 2, '4'),
    node('7', 'HOP-0007', 2, null, { via: { bundleId: 'b7', code: 'B23-0007', seasonId: 's2', seasonName: 'Dormant hardwood 2023–24', growerName: null }, full: false }),
  ],
  bundles: [
    {
      id: 'b-4',
      code: 'B21-0004',
      status: 'collected',
      cuttings: 20,
      collectedAt: '2022-01-12T10:00:00Z',
      seasonId: 's1',
      seasonName: 'Dormant hardwood 2021–22',
      growerId: 'g4',
      growerName: 'Grower 4',
      fromPlantId: '3',
      fromPlantCode: 'LYN-0033',
      farmName: 'LYN Farm',
      raised: 1,
    },
  ],
  hidden: { plants: 1, bundles: 2 },
};

const codes = (items: TreeItem[]) => items.map((i) => i.node.code);

describe('buildTraceTree', () => {
  it('chains the ancestors oldest first, puts the plant under its parent and each descendant under the plant it came from', () => {
    const top = buildTraceTree(trace);
    expect(top.node.code).toBe('WTH-0001');
    expect(top.generation).toBe(-2);
    expect(codes(top.children)).toEqual(['ARB-0034']);
    const self = top.children[0].children[0];
    expect(self.node.code).toBe('LYN-0033');
    expect(self.generation).toBe(0);
    // Children by code; the grandchild with a hidden parent hangs under the plant and says so.
    expect(codes(self.children)).toEqual(['AAA-0005', 'HOP-0007', 'ZZZ-0004']);
    const hop = self.children.find((c) => c.node.code === 'HOP-0007')!;
    expect(hop).toMatchObject({ generation: 2, parentHidden: true });
    const zzz = self.children.find((c) => c.node.code === 'ZZZ-0004')!;
    expect(codes(zzz.children)).toEqual(['GRS-0006']);
    expect(zzz.children[0]).toMatchObject({ generation: 2, parentHidden: false });
  });

  it('marks a gap in the ancestors (a hidden plant between two generations)', () => {
    const gap = { ...trace, ancestors: [node('1', 'WTH-0001', 2, null)] };
    const top = buildTraceTree(gap);
    expect(top.node.code).toBe('WTH-0001');
    expect(top.children[0]).toMatchObject({ generation: 0, parentHidden: true });
  });

  it('is the plant alone when nothing is related to it', () => {
    const top = buildTraceTree({ ...trace, ancestors: [], descendants: [], hidden: { plants: 0, bundles: 0 } });
    expect(top).toMatchObject({ generation: 0, children: [], parentHidden: false });
  });

  it('names generations in words', () => {
    expect([-5, -4, -3, -2, -1, 0, 1, 2, 3, 4, 5].map(generationLabel)).toEqual([
      '5 generations back',
      'Great-great-grandparent',
      'Great-grandparent',
      'Grandparent',
      'Parent',
      'This plant',
      'Child',
      'Grandchild',
      'Great-grandchild',
      'Great-great-grandchild',
      '5 generations on',
    ]);
  });

  it('flattens to rows with the parent each plant was raised from', () => {
    const rows = traceRows(trace);
    expect(rows.map((r) => [r.node.code, r.generation, r.parent?.code ?? null])).toEqual([
      ['WTH-0001', -2, null],
      ['ARB-0034', -1, 'WTH-0001'],
      ['LYN-0033', 0, 'ARB-0034'],
      ['AAA-0005', 1, 'LYN-0033'],
      ['ZZZ-0004', 1, 'LYN-0033'],
      ['GRS-0006', 2, 'ZZZ-0004'],
      ['HOP-0007', 2, null],
    ]);
  });
});

describe('TraceView', () => {
  function renderView() {
    return render(
      <MemoryRouter>
        <TraceView trace={trace} />
      </MemoryRouter>,
    );
  }

  it('draws the lineage as nested lists with generation labels, the bundle between generations and links to each plant', () => {
    renderView();
    const tree = screen.getByRole('list', { name: 'Lineage of LYN-0033' });
    // The grandchild GRS-0006 sits in the list of ZZZ-0004, which sits in the traced plant's list.
    const grs = within(tree).getByRole('link', { name: 'GRS-0006' });
    const zzzItem = within(tree).getByRole('link', { name: 'ZZZ-0004' }).closest('li')!;
    expect(zzzItem.contains(grs)).toBe(true);
    const selfItem = within(tree).getByText('LYN-0033').closest('li')!;
    expect(selfItem.contains(zzzItem)).toBe(true);
    const wthItem = within(tree).getByRole('link', { name: 'WTH-0001' }).closest('li')!;
    expect(wthItem.contains(selfItem)).toBe(true);
    // Four levels of lists from the grandparent down to the grandchild.
    let depth = 0;
    for (let el: HTMLElement | null = grs; el; el = el.parentElement) if (el.tagName === 'UL') depth += 1;
    expect(depth).toBe(5);

    const grsCard = grs.closest('[data-testid="trace-node"]') as HTMLElement;
    expect(within(grsCard).getByText('Grandchild')).toBeTruthy();
    expect(grsCard.textContent).toMatch(/Came as bundle B21-0006, Dormant hardwood 2021–22, to Grower 6/);
    expect(grs.getAttribute('href')).toBe('/plants/6');
    // The traced plant is marked and not a link to itself.
    expect(within(tree).queryByRole('link', { name: 'LYN-0033' })).toBeNull();
    expect(within(selfItem.querySelector('[data-testid="trace-node"]') as HTMLElement).getByText('This plant')).toBeTruthy();
    // A grower's name the person may not see is left out.
    const hopCard = within(tree).getByRole('link', { name: 'HOP-0007' }).closest('[data-testid="trace-node"]') as HTMLElement;
    expect(within(hopCard).getByText(/^Came as bundle/).textContent).toBe('Came as bundle B23-0007, Dormant hardwood 2023–24');
    expect(hopCard.textContent).toMatch(/may not see/);
    expect(screen.getByText(/1 plant and 2 bundles belong to/)).toBeTruthy();
  });

  it('lists every plant in a table that sorts by any column', async () => {
    renderView();
    const table = screen.getByRole('table', { name: 'Plants in the trace of LYN-0033' });
    const plantColumn = () => within(table).getAllByTestId('trace-row').map((r) => r.querySelectorAll('td')[1].textContent);
    expect(plantColumn()).toEqual(['WTH-0001', 'ARB-0034', 'LYN-0033', 'AAA-0005', 'ZZZ-0004', 'GRS-0006', 'HOP-0007']);
    await userEvent.click(within(table).getByRole('button', { name: /^Plant/ }));
    expect(plantColumn()).toEqual(['AAA-0005', 'ARB-0034', 'GRS-0006', 'HOP-0007', 'LYN-0033', 'WTH-0001', 'ZZZ-0004']);
    expect(within(table).getByRole('columnheader', { name: /^Plant/ }).getAttribute('aria-sort')).toBe('ascending');
    await userEvent.click(within(table).getByRole('button', { name: /^Generation/ }));
    expect(plantColumn().slice(0, 2)).toEqual(['WTH-0001', 'ARB-0034']);
    const aaa = within(table).getAllByTestId('trace-row').find((r) => r.textContent?.includes('AAA-0005'))!;
    expect(within(aaa).getByText('Hold')).toBeTruthy();
    expect(within(aaa).getByRole('link', { name: 'LYN-0033' }).getAttribute('href')).toBe('/plants/3');
  });

  it('lists the bundles that went out from the lineage', () => {
    renderView();
    const table = screen.getByRole('table', { name: 'Bundles from LYN-0033 and its descendants' });
    const rows = within(table).getAllByTestId('trace-bundle');
    expect(rows).toHaveLength(1);
    expect(rows[0].textContent).toMatch(/B21-0004.*Dormant hardwood 2021–22.*LYN-0033.*Grower 4.*20.*Collected/);
  });
});
