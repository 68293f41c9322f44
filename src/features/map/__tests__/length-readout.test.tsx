// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it } from 'vitest';
import { lineLengthM } from '../../../../shared/geo';
import { LengthReadout } from '../components/length-readout';
import { hedgerowLengthM, plannerLength } from '../lib/length';

afterEach(cleanup);

const renderReadout = (props: Parameters<typeof LengthReadout>[0]) =>
  render(
    <MemoryRouter>
      <LengthReadout {...props} />
    </MemoryRouter>,
  );

describe('hedgerow length', () => {
  it('is the geodesic length of shared/geo.ts, from Leaflet-style points', () => {
    // Published: C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87 (2013), table 3:
    // the short line from -30.12345° to -30.12344°, 0.00005° of longitude apart, is 4.944208 m.
    const len = hedgerowLengthM([
      { lat: -30.12345, lng: 0 },
      { lat: -30.12344, lng: 0.00005 },
    ]);
    expect(Math.abs(len - 4.944208)).toBeLessThan(5e-7);
    const pts = [
      { lat: 52.0855, lng: -2.6385 },
      { lat: 52.0857, lng: -2.6379 },
      { lat: 52.0853, lng: -2.6371 },
    ];
    expect(hedgerowLengthM(pts)).toBe(lineLengthM(pts.map((p) => ({ lat: p.lat, lon: p.lng }))));
  });

  it('shows the length to 0.1 m and hands the same figure to the planner', () => {
    renderReadout({ lengthM: 1234.56, points: 3, finished: true });
    expect(screen.getByTestId('hedgerow-length').textContent).toBe('1,234.6 m');
    expect(screen.getByText('3 points, measured on the WGS84 ellipsoid.')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Plan this hedgerow' }).getAttribute('href')).toBe('/planner?lengthM=1234.6');
    expect(plannerLength(4.944208)).toBe(4.9);
  });

  it('offers no plan until the line is finished', () => {
    renderReadout({ lengthM: 12.34, points: 2, finished: false });
    expect(screen.getByTestId('hedgerow-length').textContent).toBe('12.3 m');
    expect(screen.queryByRole('link', { name: 'Plan this hedgerow' })).toBeNull();
  });

  it('asks for a second point', () => {
    renderReadout({ lengthM: 0, points: 1, finished: false });
    expect(screen.getByTestId('hedgerow-length').textContent).toBe('0.0 m');
    expect(screen.getByText('Place at least two points.')).toBeTruthy();
  });
});
