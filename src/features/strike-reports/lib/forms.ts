// The two forms' schemas: the shared contract (shared/schemas/strike-reports.ts) plus the rules
// that need the bundle, which the server checks too (cuttings left to report, the date between
// collection and today, rooted cuttings left to register). The server's word is final; these
// only save a round trip.
import {
  raisePlantsSchema,
  strikeReportCreateSchema,
  strikeReportDateErrors,
  type MyBundle,
} from '../../../../shared/schemas/strike-reports';

export type ReportBundle = Pick<MyBundle, 'cuttings' | 'unreported' | 'collectedOn' | 'reported'>;

export function reportFormSchema(bundle: ReportBundle, today: string) {
  return strikeReportCreateSchema.superRefine((v, ctx) => {
    if (v.stuck > bundle.unreported) {
      ctx.addIssue({
        code: 'custom',
        path: ['stuck'],
        message:
          bundle.reported.stuck > 0
            ? `At most ${bundle.unreported}: the bundle had ${bundle.cuttings} cuttings and ${bundle.reported.stuck} are already in a report`
            : `At most ${bundle.cuttings}: the bundle had ${bundle.cuttings} cuttings`,
      });
    }
    for (const [path, message] of Object.entries(strikeReportDateErrors({ assessedOn: v.assessedOn, collectedOn: bundle.collectedOn, today }))) {
      ctx.addIssue({ code: 'custom', path: [path], message });
    }
  });
}

export const REPORT_FIELDS = ['stuck', 'rooted', 'assessedOn', 'treatment', 'notes'] as const;

export type RaiseBundle = Pick<MyBundle, 'mayRaise' | 'reported' | 'raisedPlants' | 'collectedOn' | 'reports'>;

export function raiseFormSchema(bundle: RaiseBundle) {
  return raisePlantsSchema.superRefine((v, ctx) => {
    if (bundle.reports.length === 0) {
      ctx.addIssue({ code: 'custom', path: ['count'], message: 'Report how many cuttings rooted first' });
    } else if (v.count > bundle.mayRaise) {
      const already = bundle.raisedPlants.length;
      ctx.addIssue({
        code: 'custom',
        path: ['count'],
        message: `At most ${bundle.mayRaise}: ${bundle.reported.rooted} rooted in the reports${already ? `, ${already} already registered` : ''}`,
      });
    }
    const collectionYear = Number(bundle.collectedOn.slice(0, 4));
    if (v.plantingYear < collectionYear) {
      ctx.addIssue({ code: 'custom', path: ['plantingYear'], message: `Planting year cannot be before the wood was collected (${collectionYear})` });
    }
  });
}

export const RAISE_FIELDS = ['farmId', 'count', 'role', 'plantingYear', 'bedRow', 'notes'] as const;
