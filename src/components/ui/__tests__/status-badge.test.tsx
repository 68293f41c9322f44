// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { STATUS_LOOKS, StatusBadge, type StatusKind } from '../status-badge';

afterEach(cleanup);

describe('StatusBadge', () => {
  it.each([
    ['pending', 'Awaiting admission', 'hollow-circle'],
    ['active', 'Admitted', 'filled-circle'],
    ['suspended', 'Suspended', 'square-bar'],
    ['watch', 'Watch', 'triangle'],
    ['hold', 'Hold', 'octagon'],
    ['retired', 'Retired', 'cross'],
  ] as const)('shows %s as words and a %s shape', (status, label, shape) => {
    const { container } = render(<StatusBadge status={status} />);
    expect(screen.getByText(label)).toBeTruthy();
    const svg = container.querySelector('svg');
    expect(svg?.getAttribute('data-shape')).toBe(shape);
    expect(svg?.getAttribute('aria-hidden')).toBe('true');
  });

  it('never gives two statuses in the same family the same shape', () => {
    const families: StatusKind[][] = [
      ['pending', 'active', 'suspended'],
      ['clean', 'watch', 'hold', 'retired'],
      ['planning', 'requests_open', 'allocating', 'collections', 'closed'],
      ['draft', 'filed', 'withdrawn'],
      ['scarce', 'enough', 'unoffered'],
      ['round_draft', 'proposed', 'approved', 'notified'],
      ['reserved', 'ready', 'collected', 'cancelled'],
      ['mail_queued', 'mail_sent', 'mail_failed'],
      ['report_waiting', 'report_due', 'reported'],
    ];
    for (const family of families) {
      const shapes = family.map((status) => STATUS_LOOKS[status].shape);
      expect(new Set(shapes).size).toBe(family.length);
    }
  });
});
