// Plain facts about a round for the review page: words for wood and shares, what approval
// will do, how far the solver has got, and which offers could give to a line.
import type { RoundBundle, RoundLine, RoundView } from '../../../../shared/schemas/allocation';
import type { OfferRow } from '../../../../shared/schemas/seasons';

/**
 * "60 %": whole per cent, rounded down, so a share that is not complete never reads as
 * "100 %" (149 of 150 is "99 %").
 */
export function percent(share: number): string {
  const x = Math.max(0, share);
  return `${x >= 1 ? Math.round(x * 100) : Math.floor(x * 100 + 1e-9)} %`;
}

export function count(n: number): string {
  return n.toLocaleString('en');
}

/** "Blackcurrant ‘Ben Hope’", or "Blackcurrant, any variety". */
export function woodName(speciesName: string, varietyName: string | null): string {
  return varietyName ? `${speciesName} ‘${varietyName}’` : `${speciesName}, any variety`;
}

export function km(value: number | null): string {
  return value === null ? 'distance not known' : `${value.toLocaleString('en', { maximumFractionDigits: 1 })} km`;
}

/** Live bundles: a cancelled bundle gives nothing and is not approved. */
export function liveBundles(round: Pick<RoundView, 'bundles'>): RoundBundle[] {
  return round.bundles.filter((b) => b.status !== 'cancelled');
}

/** What approving does, counted from the round as it stands. */
export function approvalPlan(round: Pick<RoundView, 'bundles'>) {
  const live = liveBundles(round);
  return {
    bundles: live.length,
    cuttings: live.reduce((sum, b) => sum + b.cuttings, 0),
    plants: new Set(live.map((b) => b.plantId)).size,
    farms: new Set(live.map((b) => b.farmId)).size,
    growers: new Set(live.map((b) => b.growerId)).size,
  };
}

/** The solver's three steps, as the server names them in `running.stage`. */
export const SOLVE_STEPS = ['Gathering offers and requests', 'Solving the allocation', 'Saving the proposal'] as const;

/** Which of SOLVE_STEPS the stage text is at (1-based); 1 when the text is not known. */
export function solveStep(stage: string | null | undefined): number {
  const s = (stage ?? '').toLowerCase();
  if (s.startsWith('saving')) return 3;
  if (s.startsWith('solving')) return 2;
  return 1;
}

/** "7 s", "1 min 05 s" */
export function elapsed(fromIso: string, now: number): string {
  const seconds = Math.max(0, Math.floor((now - new Date(fromIso).getTime()) / 1000));
  if (seconds < 60) return `${seconds} s`;
  return `${Math.floor(seconds / 60)} min ${String(seconds % 60).padStart(2, '0')} s`;
}

export type OfferChoice = { offerId: string; plantCode: string; speciesName: string; varietyName: string | null; free: number };

/**
 * Offers of one farm that could give to the line: offered this season and not withdrawn, from
 * a plant that may give wood, of the same variety (or the species, where the line takes any
 * variety or allows substitutes), with cuttings still free after this round's bundles. The
 * server checks all of it again, and the distance, when the bundle is added.
 */
export function offerChoices(line: RoundLine, offers: OfferRow[], bundles: RoundBundle[]): OfferChoice[] {
  const inRound = new Map<string, number>();
  for (const b of bundles) if (b.status !== 'cancelled') inRound.set(b.offerId, (inRound.get(b.offerId) ?? 0) + b.cuttings);
  const givingToLine = new Set(bundles.filter((b) => b.lineId === line.lineId).map((b) => b.offerId));
  const out: OfferChoice[] = [];
  for (const row of offers) {
    const offer = row.offer;
    if (!offer || offer.withdrawnAt || !row.eligible) continue;
    if (row.speciesName !== line.speciesName) continue;
    const anyVariety = line.varietyName === null || line.substitutesAllowed;
    if (!anyVariety && row.varietyName !== line.varietyName) continue;
    if (givingToLine.has(offer.id)) continue;
    const free = offer.offered - offer.reserved - (inRound.get(offer.id) ?? 0);
    if (free <= 0) continue;
    out.push({ offerId: offer.id, plantCode: row.code, speciesName: row.speciesName, varietyName: row.varietyName, free });
  }
  // The line's own variety first, then the most wood.
  return out.sort((a, b) => Number(b.varietyName === line.varietyName) - Number(a.varietyName === line.varietyName) || b.free - a.free);
}

/** The ids the server names in a refused approval (fields.bundles, comma-separated). */
export function heldBundleIds(fields: Record<string, string> | undefined): string[] {
  return (fields?.bundles ?? '').split(',').map((s) => s.trim()).filter(Boolean);
}

export const MAIL_KIND_WORDS: Record<string, string> = {
  pickup_slip: 'Pickup slip',
  farm_collections: 'Farm collection list',
};
