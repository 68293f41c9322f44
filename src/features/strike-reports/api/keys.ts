import type { StrikeRatesQuery } from '../../../../shared/schemas/strike-reports';

export const strikeReportKeys = {
  all: ['strike-reports'] as const,
  /** The signed-in grower's collected bundles, with their reports and raised plants. */
  myBundles: () => [...strikeReportKeys.all, 'my-bundles'] as const,
  rates: () => [...strikeReportKeys.all, 'rates'] as const,
  rate: (query: StrikeRatesQuery) => [...strikeReportKeys.rates(), query] as const,
};
