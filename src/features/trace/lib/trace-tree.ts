// The trace answer as a tree (oldest visible ancestor at the top, the traced plant in the
// middle, every plant raised from its wood below) and as flat rows for the table. Pure, so
// the shape is tested without a browser.
import type { Trace, TraceNode } from '../../../../shared/schemas/trace';

/** Generations from the traced plant: negative = ancestors, 0 = the plant, positive = descendants. */
export type Generation = number;

export type TreeItem = {
  node: TraceNode;
  generation: Generation;
  children: TreeItem[];
  /** The plant it was raised from is in the lineage but not shown to this person. */
  parentHidden: boolean;
};

/** Plain words for a generation: "Parent", "Grandchild", "5 generations back". */
export function generationLabel(generation: Generation): string {
  if (generation === 0) return 'This plant';
  const n = Math.abs(generation);
  const stem = generation < 0 ? 'grandparent' : 'grandchild';
  if (n === 1) return generation < 0 ? 'Parent' : 'Child';
  if (n === 2) return stem.charAt(0).toUpperCase() + stem.slice(1);
  if (n <= 4) return `Great-${'great-'.repeat(n - 3)}${stem}`;
  return `${n} generations ${generation < 0 ? 'back' : 'on'}`;
}

/** "−2", "0", "+3": the signed generation for a table cell. */
export function generationNumber(generation: Generation): string {
  if (generation === 0) return '0';
  return generation < 0 ? `\u2212${-generation}` : `+${generation}`;
}

const byCode = (a: TreeItem, b: TreeItem) => a.node.code.localeCompare(b.node.code);

/**
 * The lineage as one tree. Ancestors form a chain (a plant has one parent); a gap in their
 * depths means a plant between them is hidden from this person. Descendants hang under the
 * plant they were raised from; one whose parent is hidden hangs under the traced plant and
 * says so.
 */
export function buildTraceTree(trace: Trace): TreeItem {
  const self: TreeItem = { node: trace.plant, generation: 0, children: [], parentHidden: false };

  const items = new Map<string, TreeItem>([[self.node.id, self]]);
  const down = [...trace.descendants].sort((a, b) => a.depth - b.depth || a.code.localeCompare(b.code));
  for (const d of down) items.set(d.id, { node: d, generation: d.depth, children: [], parentHidden: false });
  for (const d of down) {
    const item = items.get(d.id)!;
    const parent = d.parentId ? items.get(d.parentId) : undefined;
    // A parent must be a generation nearer the traced plant, else the link is not a parent link.
    if (parent && parent.generation < item.generation) parent.children.push(item);
    else {
      item.parentHidden = d.depth > 1;
      self.children.push(item);
    }
  }
  for (const item of items.values()) item.children.sort(byCode);

  // Ancestors, oldest first; each one's child is the next one down the chain.
  const up = [...trace.ancestors].sort((a, b) => b.depth - a.depth);
  if (up.length === 0) {
    self.parentHidden = trace.plant.via !== null && trace.hidden.plants > 0;
    return self;
  }
  const chain: TreeItem[] = up.map((a) => ({ node: a, generation: -a.depth, children: [], parentHidden: false }));
  for (let i = 0; i < chain.length - 1; i++) {
    chain[i].children.push(chain[i + 1]);
    chain[i + 1].parentHidden = up[i].depth - up[i + 1].depth > 1;
  }
  const nearest = chain[chain.length - 1];
  nearest.children.push(self);
  self.parentHidden = up[up.length - 1].depth > 1;
  return chain[0];
}

export type TraceRow = {
  node: TraceNode;
  generation: Generation;
  /** The plant it was raised from, when that plant is shown. */
  parent: { id: string; code: string } | null;
};

/** Every plant of the trace, one row each: ancestors (oldest first), the plant, descendants by generation. */
export function traceRows(trace: Trace): TraceRow[] {
  const all = [...trace.ancestors, trace.plant, ...trace.descendants];
  const codes = new Map(all.map((n) => [n.id, n.code]));
  const row = (node: TraceNode, generation: Generation): TraceRow => {
    const code = node.parentId ? codes.get(node.parentId) : undefined;
    return { node, generation, parent: node.parentId && code ? { id: node.parentId, code } : null };
  };
  return [
    ...[...trace.ancestors].sort((a, b) => b.depth - a.depth).map((a) => row(a, -a.depth)),
    row(trace.plant, 0),
    ...[...trace.descendants].sort((a, b) => a.depth - b.depth || a.code.localeCompare(b.code)).map((d) => row(d, d.depth)),
  ];
}

/** How far the lineage reaches, for the page's lead. */
export function traceReach(trace: Trace): { ancestors: number; descendants: number; generationsBack: number; generationsOn: number } {
  return {
    ancestors: trace.ancestors.length,
    descendants: trace.descendants.length,
    generationsBack: Math.max(0, ...trace.ancestors.map((a) => a.depth)),
    generationsOn: Math.max(0, ...trace.descendants.map((d) => d.depth)),
  };
}
