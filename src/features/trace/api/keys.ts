// Query keys for traces and exposure, general to specific, so a notice sent can refresh the
// exposure it was sent from (the "notified" marks) without touching the trace.
export const traceKeys = {
  all: ['trace'] as const,
  traces: () => [...traceKeys.all, 'lineage'] as const,
  trace: (plantId: string) => [...traceKeys.traces(), plantId] as const,
  exposures: () => [...traceKeys.all, 'exposure'] as const,
  exposure: (plantId: string, findingId?: string) => [...traceKeys.exposures(), plantId, { findingId: findingId ?? null }] as const,
};
