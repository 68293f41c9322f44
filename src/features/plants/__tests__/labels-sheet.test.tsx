// @vitest-environment jsdom
import { cleanup, render, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { LabelsSheet, plantUrl, type LabelPlant } from '../components/labels-sheet';

afterEach(cleanup);

const plants: LabelPlant[] = [
  { id: 'a1b2c3d4-0000-4000-8000-000000000001', code: 'WTH-0001', varietyName: 'Ledbury Sable', speciesName: 'Blackcurrant', scientificName: 'Ribes nigrum', farmName: 'Wetherstone Farm' },
  { id: 'a1b2c3d4-0000-4000-8000-000000000002', code: 'WTH-0002', varietyName: null, speciesName: 'Gooseberry', scientificName: 'Ribes uva-crispa', farmName: 'Wetherstone Farm' },
  { id: 'a1b2c3d4-0000-4000-8000-000000000003', code: 'ARB-0107', varietyName: 'Pembridge Gold', speciesName: 'Fig', scientificName: 'Ficus carica', farmName: 'Arrowbank Nursery' },
];

describe('LabelsSheet', () => {
  it('draws one label per plant with its code, variety, species and farm, and a QR image for each', async () => {
    render(<LabelsSheet plants={plants} origin="http://heelwood.local:3000" />);
    for (const plant of plants) expect(screen.getByText(plant.code)).toBeTruthy();
    expect(screen.getByText('Ledbury Sable')).toBeTruthy();
    expect(screen.getByText('Variety not named')).toBeTruthy();
    expect(screen.getByText('Arrowbank Nursery')).toBeTruthy();

    await waitFor(() => expect(screen.getAllByRole('img', { name: /QR code opening the page of/ })).toHaveLength(3));
    for (const img of screen.getAllByRole('img', { name: /QR code/ })) {
      expect(img.getAttribute('src')).toMatch(/^data:image\/svg\+xml/);
      // An SVG drawing with the dark modules as one path.
      expect(decodeURIComponent(img.getAttribute('src') ?? '')).toContain('<path');
    }
    expect((screen.getByRole('button', { name: 'Print labels' }) as HTMLButtonElement).disabled).toBe(false);
  });

  it('points each QR code at the plant page of this Heelwood', () => {
    expect(plantUrl('https://coop.example.org/', 'abc')).toBe('https://coop.example.org/plants/abc');
  });
});
