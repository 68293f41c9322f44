import { Link } from 'react-router-dom';
import type { Trace } from '../../../../shared/schemas/trace';
import { paths } from '../../../app/paths';
import { StatusBadge } from '../../../components/ui/status-badge';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { cn } from '../../../lib/cn';
import { formatDay } from '../../../lib/format';

/** Every bundle taken from the plant and from the plants raised from it: who got it, and what was raised. */
export function TraceBundles({ trace }: { trace: Trace }) {
  if (trace.bundles.length === 0) {
    return <p className="text-ink-soft">No wood has gone out from this plant or its descendants through an approved allocation round.</p>;
  }
  const bundles = [...trace.bundles].sort((a, b) => a.seasonName.localeCompare(b.seasonName) || (a.code ?? '').localeCompare(b.code ?? ''));
  return (
    <TableShell caption={`Bundles from ${trace.plant.code} and its descendants`} tableClassName="min-w-[60rem]">
      <thead>
        <tr>
          {['Bundle', 'Season', 'From plant', 'Grower', 'Cuttings', 'Status', 'Plants raised'].map((h) => (
            <th key={h} scope="col" className={cn(th, (h === 'Cuttings' || h === 'Plants raised') && 'text-right')}>
              {h}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {bundles.map((b) => (
          <tr key={b.id} data-testid="trace-bundle">
            <td className={cn(td, 'font-semibold whitespace-nowrap')}>{b.code ?? <span className="font-normal text-ink-faint">no code</span>}</td>
            <td className={td}>{b.seasonName}</td>
            <td className={td}>
              {b.fromPlantId === trace.plant.id ? <span className="font-semibold">{b.fromPlantCode}</span> : <Link to={paths.plant(b.fromPlantId)}>{b.fromPlantCode}</Link>}
              <span className="block text-sm text-ink-soft">{b.farmName}</span>
            </td>
            <td className={td}>{b.growerName}</td>
            <td className={cn(td, 'text-right tabular-nums')}>{b.cuttings.toLocaleString('en')}</td>
            <td className={td}>
              <StatusBadge status={b.status} />
              {b.collectedAt ? <span className="mt-1 block text-sm text-ink-soft">on {formatDay(b.collectedAt)}</span> : null}
            </td>
            <td className={cn(td, 'text-right tabular-nums')}>{b.raised}</td>
          </tr>
        ))}
      </tbody>
    </TableShell>
  );
}
