import QRCode from 'qrcode';
import { useEffect, useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';

export type LabelPlant = {
  id: string;
  code: string;
  varietyName: string | null;
  speciesName: string;
  scientificName: string;
  farmName: string;
};

/** The address a label's QR code opens: the plant's own page on this Heelwood. */
export function plantUrl(origin: string, id: string): string {
  return `${origin.replace(/\/$/, '')}/plants/${encodeURIComponent(id)}`;
}

/** An SVG QR code as an image address: sharp at any print size, made entirely in the browser. */
export async function qrImage(text: string): Promise<string> {
  const svg = await QRCode.toString(text, { type: 'svg', margin: 1, errorCorrectionLevel: 'M', color: { dark: '#000000', light: '#ffffff' } });
  return `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`;
}

// Two columns of six labels on A4, each 95 x 45 mm, with a hairline to cut along. The rules
// are scoped to this page: printing hides the app's header and controls around the sheet.
const PRINT_CSS = `
@page { size: A4 portrait; margin: 10mm; }
@media print {
  html { font-size: 100% !important; background: #fff !important; }
  body:has(.hw-label-sheet) header,
  body:has(.hw-label-sheet) .hw-no-print { display: none !important; }
  body:has(.hw-label-sheet) main { padding: 0 !important; margin: 0 !important; max-width: none !important; }
  .hw-label-sheet { display: grid !important; grid-template-columns: repeat(2, 95mm) !important; grid-auto-rows: 45mm !important; gap: 0 !important; }
  .hw-label { break-inside: avoid; page-break-inside: avoid; border: 0.2mm dashed #999 !important; border-radius: 0 !important; background: #fff !important; padding: 3mm !important; height: 45mm; box-sizing: border-box; }
  .hw-label-qr { width: 36mm !important; height: 36mm !important; }
  .hw-label-code { font-size: 20pt !important; }
  .hw-label * { color: #000 !important; }
}
`;

export function LabelsSheet({ plants, origin }: { plants: LabelPlant[]; origin: string }) {
  const [images, setImages] = useState<Record<string, string>>({});
  const [failed, setFailed] = useState(false);

  useEffect(() => {
    let cancelled = false;
    setFailed(false);
    (async () => {
      const next: Record<string, string> = {};
      // In small batches, so the "n of m" count moves on a long sheet.
      for (let i = 0; i < plants.length; i += 20) {
        const batch = plants.slice(i, i + 20);
        const made = await Promise.all(batch.map((p) => qrImage(plantUrl(origin, p.id))));
        if (cancelled) return;
        batch.forEach((p, j) => (next[p.id] = made[j]));
        setImages({ ...next });
      }
    })().catch(() => {
      if (!cancelled) setFailed(true);
    });
    return () => {
      cancelled = true;
    };
  }, [plants, origin]);

  const ready = plants.every((p) => images[p.id]);
  const made = plants.filter((p) => images[p.id]).length;

  return (
    <div>
      <style>{PRINT_CSS}</style>
      <div className="hw-no-print mb-5 flex flex-col gap-3 print:hidden">
        {failed ? <Alert tone="danger">The QR codes could not be made in this browser. Reload the page to try again.</Alert> : null}
        {!ready && !failed ? (
          <div role="status" className="flex flex-col gap-1.5">
            <span className="text-sm font-medium">
              Making QR codes: {made} of {plants.length}
            </span>
            <progress className="h-3 w-full max-w-md accent-leaf" max={plants.length} value={made} />
          </div>
        ) : null}
        <div className="flex flex-wrap items-center gap-3">
          <Button onClick={() => window.print()} disabled={!ready}>
            Print labels
          </Button>
          <span className="text-ink-soft">
            {plants.length} {plants.length === 1 ? 'label' : 'labels'} · 12 to an A4 sheet, 95 × 45 mm each
          </span>
        </div>
      </div>
      <ul className="hw-label-sheet grid gap-3 sm:grid-cols-2" aria-label="Plant labels">
        {plants.map((plant) => (
          <li key={plant.id} className="hw-label flex items-center gap-4 rounded-lg border border-dashed border-bark-light bg-white p-3">
            {images[plant.id] ? (
              <img src={images[plant.id]} alt={`QR code opening the page of ${plant.code}`} className="hw-label-qr h-28 w-28 shrink-0" />
            ) : (
              <span className="hw-label-qr h-28 w-28 shrink-0 rounded bg-paper-deep" aria-hidden="true" />
            )}
            <div className="min-w-0 leading-tight">
              <p className="hw-label-code text-2xl font-bold tracking-wide">{plant.code}</p>
              <p className="mt-1 font-semibold">{plant.varietyName ?? 'Variety not named'}</p>
              <p className="text-sm">
                {plant.speciesName} · <i>{plant.scientificName}</i>
              </p>
              <p className="mt-1 text-sm">{plant.farmName}</p>
            </div>
          </li>
        ))}
      </ul>
    </div>
  );
}
