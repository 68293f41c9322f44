import type { RoundView } from '../../../../shared/schemas/allocation';
import { StatusBadge, type StatusKind } from '../../../components/ui/status-badge';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { count, percent } from '../lib/round-facts';
import { FillBar } from './fill-bar';

type Supply = RoundView['supply'][number];

function pressure(row: Supply): StatusKind | null {
  if (row.varietyName === null || row.asked === 0) return null;
  if (row.offered === 0) return 'unoffered';
  return row.asked > row.offered ? 'scarce' : 'enough';
}

/** Wood offered, asked and allocated per species and variety. */
export function SupplyTable({ supply }: { supply: Supply[] }) {
  const rows = supply.filter((s) => s.offered > 0 || s.asked > 0);
  if (rows.length === 0) return <p className="text-ink-soft">No wood was offered or asked for in this season.</p>;
  return (
    <TableShell caption="Supply and demand by variety" tableClassName="min-w-[44rem]">
      <thead>
        <tr>
          <th scope="col" className={th}>
            Species and variety
          </th>
          <th scope="col" className={`${th} text-right`}>
            Free on offer
          </th>
          <th scope="col" className={`${th} text-right`}>
            Asked
          </th>
          <th scope="col" className={`${th} text-right`}>
            Allocated
          </th>
          <th scope="col" className={th}>
            Share of the ask met
          </th>
        </tr>
      </thead>
      <tbody>
        {rows.map((s) => {
          const status = pressure(s);
          return (
            <tr key={`${s.speciesName}|${s.varietyName ?? ''}`}>
              <th scope="row" className={`${td} text-left font-normal`}>
                <span className="font-semibold">{s.speciesName}</span> <span>{s.varietyName ? `‘${s.varietyName}’` : <i>any variety</i>}</span>
                {status ? (
                  <span className="mt-1 block">
                    <StatusBadge status={status} />
                  </span>
                ) : null}
              </th>
              <td className={`${td} text-right tabular-nums`}>{s.varietyName === null ? <span title="Met from the varieties listed">—</span> : count(s.offered)}</td>
              <td className={`${td} text-right tabular-nums`}>{count(s.asked)}</td>
              <td className={`${td} text-right tabular-nums`}>{count(s.allocated)}</td>
              <td className={`${td} min-w-56`}>{s.asked > 0 ? <FillBar share={s.allocated / s.asked} label={`${percent(s.allocated / s.asked)} met`} /> : <span className="text-ink-soft">Not asked for</span>}</td>
            </tr>
          );
        })}
      </tbody>
    </TableShell>
  );
}
