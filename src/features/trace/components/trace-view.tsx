import type { Trace } from '../../../../shared/schemas/trace';
import { Alert } from '../../../components/ui/alert';
import { Card, CardTitle } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { plural } from '../../../lib/format';
import { traceReach } from '../lib/trace-tree';
import { TraceBundles } from './trace-bundles';
import { TraceTable } from './trace-table';
import { TraceTree } from './trace-tree';

/** One sentence on how far the lineage reaches, for the page's lead. */
export function traceSummary(trace: Trace): string {
  const r = traceReach(trace);
  const back = r.ancestors ? `${plural(r.ancestors, 'ancestor')} over ${plural(r.generationsBack, 'generation')}` : 'no ancestors in the register';
  const on = r.descendants ? `${plural(r.descendants, 'plant')} raised from its wood over ${plural(r.generationsOn, 'generation')}` : 'no plants raised from its wood yet';
  return `${trace.plant.code} has ${back}, and ${on}; ${plural(trace.bundles.length, 'bundle')} of wood went out from this lineage.`;
}

/** The trace of one plant: the tree, the same plants as a table, and the bundles between them. */
export function TraceView({ trace }: { trace: Trace }) {
  const { hidden } = trace;
  const alone = trace.ancestors.length === 0 && trace.descendants.length === 0;
  return (
    <div className="flex flex-col gap-5">
      {hidden.plants || hidden.bundles ? (
        <Alert tone="info" title="Part of this lineage is not shown to you">
          {[hidden.plants ? plural(hidden.plants, 'plant') : null, hidden.bundles ? plural(hidden.bundles, 'bundle') : null].filter(Boolean).join(' and ')} belong to
          other farms and growers. You see clean plants of other farms, your own farms' plants, and the bundles you received or your farms gave.
        </Alert>
      ) : null}
      <Card>
        <CardTitle>Lineage</CardTitle>
        <p className="mb-4 text-ink-soft">Oldest ancestor at the top; under each plant, the plants raised from its wood, with the bundle each one came as.</p>
        <TraceTree trace={trace} />
        {alone ? (
          <div className="mt-4">
            <EmptyState title="A lineage of one">
              This plant was not raised from another plant in the register, and no plant has been registered as raised from its wood. When a grower registers a
              plant raised from one of its bundles, it appears here.
            </EmptyState>
          </div>
        ) : null}
      </Card>
      <Card>
        <CardTitle>Every plant in the trace</CardTitle>
        <TraceTable trace={trace} />
      </Card>
      <Card>
        <CardTitle>Bundles from this lineage ({trace.bundles.length})</CardTitle>
        <p className="mb-4 text-ink-soft">Wood taken from this plant and from every plant raised from it, in approved allocation rounds (cancelled bundles moved no wood and are left out).</p>
        <TraceBundles trace={trace} />
      </Card>
    </div>
  );
}
