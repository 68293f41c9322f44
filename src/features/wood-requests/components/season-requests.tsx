import { Alert } from '../../../components/ui/alert';
import { Loading } from '../../../components/ui/loading';
import { StatusBadge } from '../../../components/ui/status-badge';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { errorMessage } from '../../../lib/api-client';
import { useSeasonRequests } from '../api/get-season-requests';
import { formDateTimeSafe } from '../lib/words';

/** Coordinator's view: every request of the season that is not withdrawn. */
export function SeasonRequests({ seasonId }: { seasonId: string }) {
  const requests = useSeasonRequests(seasonId);
  if (requests.isPending) return <Loading label="Loading the season's requests…" />;
  if (requests.isError) {
    return (
      <Alert tone="danger" title="The requests did not load">
        {errorMessage(requests.error)}
      </Alert>
    );
  }
  const items = requests.data.items;
  if (items.length === 0) return <p className="text-ink-soft">No requests yet. Growers file them from the season page or the planner.</p>;
  return (
    <TableShell caption="Requests of the season" tableClassName="min-w-[44rem]">
      <thead>
        <tr>
          <th scope="col" className={th}>
            Grower
          </th>
          <th scope="col" className={th}>
            Status
          </th>
          <th scope="col" className={th}>
            Lines
          </th>
          <th scope="col" className={`${th} text-right`}>
            Cuttings
          </th>
          <th scope="col" className={`${th} text-right`}>
            Distance
          </th>
          <th scope="col" className={th}>
            Last changed
          </th>
        </tr>
      </thead>
      <tbody>
        {items.map((r) => (
          <tr key={r.id}>
            <td className={td}>
              <span className="font-semibold">{r.growerName}</span>
              {r.destinationLabel ? <span className="block text-sm text-ink-soft">{r.destinationLabel}</span> : null}
            </td>
            <td className={td}>
              <StatusBadge status={r.status} />
            </td>
            <td className={td}>
              <ul className="text-sm">
                {r.lines.map((l) => (
                  <li key={l.id}>
                    {l.speciesName}, {l.varietyName ?? 'any variety'}: {l.cuttings}
                  </li>
                ))}
              </ul>
            </td>
            <td className={`${td} text-right font-semibold tabular-nums`}>{r.lines.reduce((s, l) => s + l.cuttings, 0).toLocaleString('en')}</td>
            <td className={`${td} text-right tabular-nums`}>{r.maxDistanceKm} km</td>
            <td className={td}>{formDateTimeSafe(r.updatedAt)}</td>
          </tr>
        ))}
      </tbody>
    </TableShell>
  );
}
