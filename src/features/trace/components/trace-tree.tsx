import { Link } from 'react-router-dom';
import type { Trace, TraceNode } from '../../../../shared/schemas/trace';
import { paths } from '../../../app/paths';
import { StatusBadge } from '../../../components/ui/status-badge';
import { cn } from '../../../lib/cn';
import { buildTraceTree, generationLabel, type TreeItem } from '../lib/trace-tree';

/** "Came as bundle B21-0002, Dormant hardwood 2021–22, to Dafydd Parry". */
export function ViaText({ node }: { node: TraceNode }) {
  if (!node.via) return null;
  const { code, seasonName, growerName } = node.via;
  return (
    <>
      Came as bundle <strong className="font-semibold">{code ?? 'without a code'}</strong>, {seasonName}
      {growerName ? `, to ${growerName}` : ''}
    </>
  );
}

function NodeCard({ item }: { item: TreeItem }) {
  const { node, generation } = item;
  const self = generation === 0;
  return (
    <div
      data-testid="trace-node"
      data-generation={generation}
      className={cn('flex flex-col gap-1 rounded-lg border bg-white/80 px-3 py-2', self ? 'border-2 border-currant bg-currant-light/40' : 'border-paper-edge')}
    >
      <p className="text-sm font-semibold uppercase tracking-wide text-ink-soft">{generationLabel(generation)}</p>
      <p className="flex flex-wrap items-center gap-x-2 gap-y-1">
        {self ? (
          <span className="text-lg font-bold">{node.code}</span>
        ) : (
          <Link to={paths.plant(node.id)} className="text-lg font-semibold">
            {node.code}
          </Link>
        )}
        <StatusBadge status={node.healthStatus} />
      </p>
      <p className="text-ink-soft">
        {node.varietyName ? <span className="font-medium text-ink">{node.varietyName} · </span> : null}
        {node.speciesName} · {node.farmName}
      </p>
      {node.via ? (
        <p className="text-sm">
          <ViaText node={node} />
        </p>
      ) : null}
      {item.parentHidden ? <p className="text-sm italic text-ink-soft">Raised from a plant of this lineage that your account may not see.</p> : null}
    </div>
  );
}

function Branch({ item }: { item: TreeItem }) {
  return (
    <li className="flex flex-col gap-2">
      <NodeCard item={item} />
      {item.children.length > 0 ? (
        <ul className="ml-3 flex flex-col gap-2 border-l-2 border-bark-light pl-4 sm:ml-5 sm:pl-5">
          {item.children.map((child) => (
            <Branch key={child.node.id} item={child} />
          ))}
        </ul>
      ) : null}
    </li>
  );
}

/**
 * The lineage as nested lists: each plant's list holds the plants raised from it, so a
 * screen reader announces the depth of each plant and the generation label says it in words.
 */
export function TraceTree({ trace }: { trace: Trace }) {
  const top = buildTraceTree(trace);
  return (
    <ul aria-label={`Lineage of ${trace.plant.code}`} className="flex flex-col gap-2">
      <Branch item={top} />
    </ul>
  );
}
