// A season's figures: wood offered, asked, allocated and collected; how well request lines
// were filled; travel; strike rates from this season's reports; the value of plants raised.
import type { Hemisphere, SeasonKind, SeasonStage, Treatment } from '../domain.js';

/** Cuttings, by species and variety. */
export type WoodFigures = { offered: number; asked: number; allocated: number; collected: number; cancelled: number };

export type FiguresRow = WoodFigures & {
  speciesId: string;
  speciesName: string;
  /** Null: asked for "any variety", or wood from plants of no named variety. */
  varietyId: string | null;
  varietyName: string | null;
};

export type LineFill = {
  lineId: string;
  growerName: string;
  speciesName: string;
  varietyName: string | null;
  asked: number;
  allocated: number;
  collected: number;
  /** allocated / asked, at most 1. */
  ratio: number;
};

export type FillSummary = {
  lines: number;
  fullyMet: number;
  partlyMet: number;
  unmet: number;
  meanRatio: number | null;
  medianRatio: number | null;
  minRatio: number | null;
  /** Cuttings allocated over cuttings asked, all lines together. */
  overallRatio: number | null;
};

export type GrowerTrip = { growerId: string; growerName: string; farms: number; bundles: number; roundTripKm: number | null };

export type TravelFigures = {
  bundles: number;
  /** Sum of each bundle's distance from the grower's place to the farm. */
  bundleKm: number;
  /** Shortest round trips, one per grower (shared/visiting-order.ts); straight lines, not roads. */
  growers: GrowerTrip[];
  roundTripKm: number;
};

export type SeasonStrikeRate = {
  level: 'species' | 'variety';
  speciesId: string;
  speciesName: string;
  varietyId: string | null;
  varietyName: string | null;
  treatment: Treatment;
  reports: number;
  stuck: number;
  rooted: number;
  /** rooted / stuck in this season's reports. */
  observed: number;
  /** The species' prior updated by this season's reports only: mean and 90 % interval. */
  rate: number;
  low: number;
  high: number;
};

export type RaisedRow = {
  speciesId: string;
  speciesName: string;
  collectionYear: number;
  firstCropYears: number;
  firstCropYear: number;
  rooted: number;
  value: number;
};

export type RaisedFigures = {
  valuePerPlant: number;
  currency: string | null;
  rooted: number;
  value: number;
  bySpecies: RaisedRow[];
  byFirstCropYear: { year: number; rooted: number; value: number }[];
};

export type SeasonFigures = {
  season: { id: string; name: string; kind: SeasonKind; hemisphere: Hemisphere; stage: SeasonStage };
  /** cooperative: everything; member: the caller's farms' offers and bundles, and the caller's own requests and bundles. */
  scope: 'cooperative' | 'member';
  totals: WoodFigures;
  bySpecies: FiguresRow[];
  byVariety: FiguresRow[];
  fill: FillSummary;
  lines: LineFill[];
  travel: TravelFigures;
  strikeRates: SeasonStrikeRate[];
  raised: RaisedFigures;
};
