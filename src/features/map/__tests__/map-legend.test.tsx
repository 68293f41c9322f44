// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { HEALTH_STATUSES } from '../../../../shared/domain';
import { STATUS_LOOKS } from '../../../components/ui/status-badge';
import { MapLegend } from '../components/map-legend';
import { plantIconHtml } from '../lib/marker-icons';

afterEach(cleanup);

describe('MapLegend', () => {
  it('names every health status in words, each with its own shape', () => {
    render(<MapLegend />);
    const legend = screen.getByTestId('map-legend');
    const shapes = new Set<string>();
    for (const status of HEALTH_STATUSES) {
      const row = legend.querySelector(`li[data-status="${status}"]`) as HTMLElement;
      expect(row, status).not.toBeNull();
      expect(within(row).getByText(STATUS_LOOKS[status].label)).toBeTruthy();
      const shape = row.querySelector('svg[data-shape]')?.getAttribute('data-shape');
      expect(shape, status).toBe(STATUS_LOOKS[status].shape);
      shapes.add(shape!);
    }
    // Four statuses, four different shapes: never colour alone.
    expect(shapes.size).toBe(HEALTH_STATUSES.length);
  });

  it('draws each plant on the map with the same shape as the legend, and says its status in words', () => {
    for (const status of HEALTH_STATUSES) {
      const html = plantIconHtml({ code: 'WTH-0001', healthStatus: status, speciesName: 'Blackcurrant', varietyName: 'Ledbury Sable' });
      const el = document.createElement('div');
      el.innerHTML = html;
      expect(el.querySelector('svg')?.getAttribute('data-shape')).toBe(STATUS_LOOKS[status].shape);
      expect(el.querySelector('[role="img"]')?.getAttribute('aria-label')).toBe(`WTH-0001, Blackcurrant Ledbury Sable, ${STATUS_LOOKS[status].label}`);
      expect(el.textContent).toBe('WTH-0001');
    }
  });

  it('escapes what it writes into marker HTML', () => {
    const el = document.createElement('div');
    el.innerHTML = plantIconHtml({ code: 'A<b>', healthStatus: 'clean', speciesName: '"x"', varietyName: null });
    expect(el.querySelector('b')).toBeNull();
    expect(el.textContent).toBe('A<b>');
  });
});
