import QRCode from 'qrcode';
import { useEffect, useMemo, useState } from 'react';
import type { FarmCollection } from '../../../../shared/schemas/allocation';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { errorMessage } from '../../../lib/api-client';
import { useCollections } from '../api/get-collections';
import { useFarmPlants } from '../api/get-farm-plants';

export type BundleLabel = {
  key: string;
  code: string;
  speciesName: string;
  varietyName: string | null;
  plantCode: string;
  growerName: string;
  cuttings: number;
  /** What the QR code holds: the source plant's page here, or the bundle code as text. */
  qrText: string;
  qrOpensPlant: boolean;
};

/** The address a label's QR code opens: the source plant's page on this Heelwood. */
export function plantPageUrl(origin: string, plantId: string): string {
  return `${origin.replace(/\/$/, '')}/plants/${encodeURIComponent(plantId)}`;
}

/**
 * One label per approved bundle that is not cancelled. FarmCollection carries the plant's
 * code but not its id, so the id is looked up among the farm's plants of the season (its
 * offers list, which the farm's people and coordinators may read). Where no id is found,
 * the QR code holds the bundle code as plain text instead of the plant's address.
 */
export function bundleLabels(items: FarmCollection[], plantIdByCode: Map<string, string>, origin: string): BundleLabel[] {
  return items
    .filter((b) => b.status !== 'cancelled' && b.code)
    .sort((a, b) => (a.code ?? '').localeCompare(b.code ?? ''))
    .map((b) => {
      const plantId = plantIdByCode.get(b.plantCode);
      return {
        key: b.bundleId,
        code: b.code!,
        speciesName: b.speciesName,
        varietyName: b.varietyName,
        plantCode: b.plantCode,
        growerName: b.growerName,
        cuttings: b.cuttings,
        qrText: plantId ? plantPageUrl(origin, plantId) : b.code!,
        qrOpensPlant: !!plantId,
      };
    });
}

export function qrDataUrl(text: string): Promise<string> {
  return QRCode.toDataURL(text, { margin: 1, width: 240, errorCorrectionLevel: 'M', color: { dark: '#000000', light: '#ffffff' } });
}

// Two columns of five labels on A4, 95 x 54 mm each, with a dashed line to cut along.
const PRINT_CSS = `
@page { size: A4 portrait; margin: 10mm; }
@media print {
  html, body { font-size: 100% !important; background: #fff !important; }
  body:has(.hw-bundle-sheet) header,
  body:has(.hw-bundle-sheet) .hw-no-print { display: none !important; }
  body:has(.hw-bundle-sheet) main { padding: 0 !important; margin: 0 !important; max-width: none !important; }
  .hw-bundle-sheet { display: grid !important; grid-template-columns: repeat(2, 95mm) !important; grid-auto-rows: 54mm !important; gap: 0 !important; }
  .hw-bundle-label { break-inside: avoid; page-break-inside: avoid; border: 0.2mm dashed #888 !important; border-radius: 0 !important; background: #fff !important; padding: 3mm !important; height: 54mm; box-sizing: border-box; }
  .hw-bundle-qr { width: 30mm !important; height: 30mm !important; }
  .hw-bundle-code { font-size: 22pt !important; }
  .hw-bundle-label * { color: #000 !important; }
}
`;

export function BundleLabelsSheet({ labels }: { labels: BundleLabel[] }) {
  const [images, setImages] = useState<Record<string, string>>({});
  const [failed, setFailed] = useState(false);

  useEffect(() => {
    let cancelled = false;
    setFailed(false);
    (async () => {
      const next: Record<string, string> = {};
      for (const label of labels) {
        next[label.key] = await qrDataUrl(label.qrText);
        if (cancelled) return;
      }
      setImages(next);
    })().catch(() => {
      if (!cancelled) setFailed(true);
    });
    return () => {
      cancelled = true;
    };
  }, [labels]);

  const ready = labels.every((l) => images[l.key]);
  const textOnly = labels.filter((l) => !l.qrOpensPlant).length;

  return (
    <div>
      <style>{PRINT_CSS}</style>
      <div className="hw-no-print mb-5 flex flex-col gap-3 print:hidden">
        {failed ? <Alert tone="danger">The QR codes could not be made in this browser. The labels still print with their codes.</Alert> : null}
        {textOnly > 0 ? (
          <Alert tone="info">
            {textOnly === labels.length ? 'The QR codes' : `${textOnly} of the QR codes`} hold the bundle code as text, because the source plant could not be
            found among this farm's plants.
          </Alert>
        ) : null}
        <div className="flex flex-wrap items-center gap-3">
          <Button onClick={() => window.print()} disabled={!ready && !failed}>
            Print labels
          </Button>
          <span className="text-ink-soft">
            {labels.length === 1 ? '1 label' : `${labels.length} labels`} · 10 to an A4 sheet, 95 × 54 mm each. Tie one to each bundle.
          </span>
        </div>
      </div>
      <ul className="hw-bundle-sheet grid gap-3 sm:grid-cols-2" aria-label="Bundle labels">
        {labels.map((l) => (
          <li key={l.key} className="hw-bundle-label flex items-center gap-4 rounded-lg border border-dashed border-bark-light bg-white p-3" data-testid="bundle-label">
            {images[l.key] ? (
              <img
                src={images[l.key]}
                alt={l.qrOpensPlant ? `QR code opening the page of plant ${l.plantCode}` : `QR code holding the bundle code ${l.code}`}
                className="hw-bundle-qr h-28 w-28 shrink-0"
              />
            ) : (
              <span className="hw-bundle-qr h-28 w-28 shrink-0 rounded bg-paper-deep" aria-hidden="true" />
            )}
            <div className="min-w-0 leading-tight">
              <p className="hw-bundle-code font-mono text-3xl font-bold tracking-wide">{l.code}</p>
              <p className="mt-1 font-semibold">{l.varietyName ?? 'Any variety'}</p>
              <p className="text-sm">{l.speciesName}</p>
              <p className="mt-1 text-sm">
                From plant <span className="font-mono font-semibold">{l.plantCode}</span>
              </p>
              <p className="text-sm">For {l.growerName}</p>
              <p className="text-sm font-semibold">{l.cuttings.toLocaleString('en')} cuttings</p>
            </div>
          </li>
        ))}
      </ul>
    </div>
  );
}

export function BundleLabels({ seasonId, farmId, farmName }: { seasonId: string; farmId: string; farmName: string }) {
  const list = useCollections(seasonId, farmId);
  const plants = useFarmPlants(seasonId, farmId);
  const labels = useMemo(() => {
    if (!list.data || plants.isPending) return null;
    const byCode = new Map((plants.data?.items ?? []).map((p) => [p.code, p.plantId]));
    return bundleLabels(list.data.items, byCode, window.location.origin);
  }, [list.data, plants.data, plants.isPending]);

  if (list.isPending || (plants.isPending && !plants.isError)) return <Loading label="Loading the bundles…" />;
  if (list.isError) return <Alert tone="danger">The bundles did not load: {errorMessage(list.error)}</Alert>;
  if (!labels || labels.length === 0) {
    return (
      <EmptyState title="No bundle labels to print">
        {farmName} has no approved bundles in this season yet. Labels can be printed once a round that takes wood from this farm is approved.
      </EmptyState>
    );
  }
  return <BundleLabelsSheet labels={labels} />;
}
