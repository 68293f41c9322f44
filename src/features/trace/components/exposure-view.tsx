import { Link } from 'react-router-dom';
import type { Exposure, ExposedBundle, ExposureFinding } from '../../../../shared/schemas/trace';
import { paths } from '../../../app/paths';
import { Alert } from '../../../components/ui/alert';
import { Card, CardTitle } from '../../../components/ui/card';
import { StatusBadge } from '../../../components/ui/status-badge';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { cn } from '../../../lib/cn';
import { formatDay, plural } from '../../../lib/format';
import { generationLabel } from '../lib/trace-tree';

const SEVERITY_WORDS = { minor: 'minor', moderate: 'moderate', severe: 'severe' } as const;

export function pestTitle(f: ExposureFinding): string {
  const { name, scientificName } = f.pest;
  return scientificName && scientificName !== name ? `${name} (${scientificName})` : name;
}

function FindingCard({ exposure, finding }: { exposure: Exposure; finding: ExposureFinding }) {
  return (
    <Card tone="caution">
      <CardTitle>The finding</CardTitle>
      <p className="text-lg">
        <strong>{pestTitle(finding)}</strong> on {exposure.plant.code}, recorded on <time dateTime={finding.inspectedOn}>{formatDay(finding.inspectedOn)}</time>,{' '}
        {SEVERITY_WORDS[finding.severity]}. It travels in cutting wood.
      </p>
      {finding.notes ? <p className="mt-1 text-ink-soft">Inspector's note: {finding.notes}</p> : null}
      <p className="mt-3">
        {exposure.since ? (
          <>
            Last clean inspection before it: <strong>{formatDay(exposure.since)}</strong>. Wood collected from that day on may carry it.
          </>
        ) : (
          <>This plant has no clean inspection on record before the finding, so all of its wood counts.</>
        )}
      </p>
      <details className="mt-2">
        <summary className="min-h-touch cursor-pointer content-center font-medium">The rule Heelwood applies</summary>
        <p className="text-ink-soft">{exposure.rule}</p>
      </details>
    </Card>
  );
}

function BundleRows({ bundles, caption }: { bundles: ExposedBundle[]; caption: string }) {
  return (
    <TableShell caption={caption} tableClassName="min-w-[52rem]">
      <thead>
        <tr>
          {['Bundle', 'From plant', 'Season', 'Grower', 'Cuttings', 'Status'].map((h) => (
            <th key={h} scope="col" className={cn(th, h === 'Cuttings' && 'text-right')}>
              {h}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {bundles.map((b) => (
          <tr key={b.id} data-testid="exposed-bundle">
            <td className={cn(td, 'font-semibold whitespace-nowrap')}>{b.code ?? <span className="font-normal text-ink-faint">no code</span>}</td>
            <td className={td}>
              <Link to={paths.plant(b.fromPlantId)}>{b.fromPlantCode}</Link>
              <span className="block text-sm text-ink-soft">{b.farmName}</span>
            </td>
            <td className={td}>{b.seasonName}</td>
            <td className={td}>{b.growerName}</td>
            <td className={cn(td, 'text-right tabular-nums')}>{b.cuttings.toLocaleString('en')}</td>
            <td className={td}>
              <StatusBadge status={b.status} />
              {b.collectedOn ? <span className="mt-1 block text-sm text-ink-soft">on {formatDay(b.collectedOn)}</span> : null}
            </td>
          </tr>
        ))}
      </tbody>
    </TableShell>
  );
}

/**
 * What may carry a finding that travels in wood: the wood collected from the plant and its
 * descendants since its last clean inspection, the plants raised from it, and the growers who
 * got it (with whether this finding's notice has reached them).
 */
export function ExposureView({ exposure, finding }: { exposure: Exposure; finding: ExposureFinding }) {
  return (
    <div className="flex flex-col gap-5">
      <FindingCard exposure={exposure} finding={finding} />

      {exposure.pending.length > 0 ? (
        <Alert tone="warning" title={`${plural(exposure.pending.length, 'approved bundle')} from exposed plants not collected yet`}>
          <p>Cancel {exposure.pending.length === 1 ? 'it' : 'them'} before anyone collects: the wood may carry the finding.</p>
          <ul className="mt-2 list-disc pl-6">
            {exposure.pending.map((b) => (
              <li key={b.id}>
                {b.code ?? 'a bundle with no code'}: {plural(b.cuttings, 'cutting')} from {b.fromPlantCode} ({b.farmName}) for {b.growerName}, {b.seasonName}
              </li>
            ))}
          </ul>
        </Alert>
      ) : null}

      <Card>
        <CardTitle>Wood that may carry it ({exposure.bundles.length})</CardTitle>
        {exposure.bundles.length === 0 ? (
          <p className="text-ink-soft">No wood was collected from this plant or from plants raised from it {exposure.since ? `since ${formatDay(exposure.since)}` : 'at all'}.</p>
        ) : (
          <BundleRows bundles={exposure.bundles} caption="Bundles collected since the last clean inspection" />
        )}
      </Card>

      <Card>
        <CardTitle>Plants raised from that wood ({exposure.plants.length})</CardTitle>
        {exposure.plants.length === 0 ? (
          <p className="text-ink-soft">No plant in the register was raised from that wood.</p>
        ) : (
          <ul className="flex flex-col divide-y divide-paper-edge">
            {exposure.plants.map((p) => (
              <li key={p.id} className="flex flex-wrap items-center gap-x-3 gap-y-1 py-2" data-testid="exposed-plant">
                <Link to={paths.plant(p.id)} className="font-semibold">
                  {p.code}
                </Link>
                <StatusBadge status={p.healthStatus} />
                <span className="text-ink-soft">
                  {p.farmName} · {p.depth <= 4 ? `${generationLabel(p.depth).toLowerCase()} of` : `${p.depth} generations on from`} {exposure.plant.code}
                  {p.sourceBundleCode ? ` · from bundle ${p.sourceBundleCode}` : ''}
                </span>
              </li>
            ))}
          </ul>
        )}
      </Card>

      <Card>
        <CardTitle>Growers who got it ({exposure.growers.length})</CardTitle>
        {exposure.growers.length === 0 ? (
          <p className="text-ink-soft">Nobody received wood that may carry the finding: there is no one to notify.</p>
        ) : (
          <ul className="flex flex-col divide-y divide-paper-edge" aria-label="Growers who got wood that may carry the finding">
            {exposure.growers.map((g) => (
              <li key={g.id} className="flex flex-wrap items-center justify-between gap-2 py-3" data-testid="exposed-grower">
                <span>
                  <span className="font-semibold">{g.name}</span> <span className="text-ink-soft">{g.email}</span>
                  <span className="block text-sm text-ink-soft">Bundles {g.bundles.join(', ')}</span>
                </span>
                <StatusBadge status={g.notified ? 'notice_sent' : 'notice_due'} />
              </li>
            ))}
          </ul>
        )}
      </Card>
    </div>
  );
}
