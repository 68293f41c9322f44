import { useId, useState } from 'react';
import { Link } from 'react-router-dom';
import { LABELS } from '../../../../shared/domain';
import type { MyBundle, MyBundles, RaisedPlant, StrikeReportView } from '../../../../shared/schemas/strike-reports';
import { paths } from '../../../app/paths';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { StatusBadge } from '../../../components/ui/status-badge';
import { formatDay } from '../../../lib/format';
import { reportStatus } from '../lib/report-status';
import { rootedWords, todayIso, whole, woodName } from '../lib/words';
import { RaisePlantsForm } from './raise-plants-form';
import { ReportList } from './report-list';
import { StrikeReportForm } from './strike-report-form';

export type BundleCallbacks = {
  /** A report was filed or removed: strike rates changed. */
  onReportsChanged?: () => void;
  /** Plants were registered: the register changed. */
  onPlantsRaised?: () => void;
};

function RaisedList({ plants }: { plants: { id: string; code: string; farmName?: string }[] }) {
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1">
      {plants.map((p) => (
        <li key={p.id}>
          <Link to={paths.plant(p.id)} className="font-mono font-semibold">
            {p.code}
          </Link>
          {p.farmName ? <span className="text-sm text-ink-soft"> at {p.farmName}</span> : null}
        </li>
      ))}
    </ul>
  );
}

/** One collected bundle: what it was, its strike reports, the report form, and plants raised from it. */
export function BundleCard({ bundle, farms, today = todayIso(), onReportsChanged, onPlantsRaised }: { bundle: MyBundle; farms: MyBundles['farms']; today?: string } & BundleCallbacks) {
  const id = useId();
  const status = reportStatus(bundle, today);
  const [reporting, setReporting] = useState(false);
  const [raising, setRaising] = useState(false);
  const [filed, setFiled] = useState<StrikeReportView | null>(null);
  const [raised, setRaised] = useState<RaisedPlant[] | null>(null);
  const name = woodName(bundle.species.name, bundle.variety?.name);
  // A report deleted since it was filed here is no longer news.
  const shownFiled = filed && bundle.reports.some((r) => r.id === filed.id) ? filed : null;

  return (
    <article aria-labelledby={`${id}-title`} className="flex flex-col gap-4 rounded-card border border-paper-edge bg-white/60 p-4 sm:p-5" data-testid="my-bundle">
      <header className="flex flex-col gap-2">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id={`${id}-title`} className="text-xl font-semibold">
            <span className="font-mono tracking-wide">{bundle.code ?? 'Bundle'}</span> <span className="text-ink-soft">·</span> {name}
          </h2>
          <StatusBadge status={status.kind} />
        </div>
        <p className="text-ink-soft">
          {whole(bundle.cuttings)} cuttings from plant{' '}
          <Link to={paths.plant(bundle.plant.id)} className="font-mono">
            {bundle.plant.code}
          </Link>{' '}
          at {bundle.farm.name}, collected on <time dateTime={bundle.collectedOn}>{formatDay(bundle.collectedOn)}</time> · {bundle.seasonName} · planned treatment:{' '}
          {LABELS.treatment[bundle.plannedTreatment].toLowerCase()}
        </p>
        <p className={status.kind === 'report_due' ? 'font-medium' : 'text-ink-soft'}>{status.text}</p>
      </header>

      {shownFiled ? (
        <Alert tone="success" title="Strike report filed">
          {rootedWords(shownFiled.rooted, shownFiled.stuck)}, counted on {formatDay(shownFiled.assessedOn)}. The strike rates the planner uses include it now:{' '}
          <Link to={paths.strikeRates({ speciesId: bundle.species.id, treatment: shownFiled.treatment })}>see the strike rate for {bundle.species.name}</Link>.
        </Alert>
      ) : null}

      <section aria-labelledby={`${id}-reports`} className="flex flex-col gap-3">
        <h3 id={`${id}-reports`} className="font-semibold">
          Strike reports
          {bundle.reports.length ? <span className="font-normal text-ink-soft"> · {rootedWords(bundle.reported.rooted, bundle.reported.stuck)} in all</span> : null}
        </h3>
        <ReportList reports={bundle.reports} bundleCode={bundle.code} onChanged={onReportsChanged} />
        {bundle.unreported > 0 ? (
          reporting ? (
            <div className="rounded-lg border-2 border-currant/30 bg-currant-light/40 p-4">
              <h4 className="mb-3 font-semibold">File a strike report</h4>
              {/* Not keyed by the report count: the form stays mounted while the photo of a report it just filed uploads. */}
              <StrikeReportForm
                bundle={bundle}
                today={today}
                onChanged={onReportsChanged}
                onFiled={(report) => {
                  setFiled(report);
                  setReporting(false);
                }}
              />
              <Button variant="quiet" size="sm" className="mt-2" onClick={() => setReporting(false)}>
                Not now
              </Button>
            </div>
          ) : (
            <div>
              <Button variant={bundle.reports.length ? 'secondary' : 'primary'} onClick={() => setReporting(true)}>
                {bundle.reports.length ? 'Report more cuttings' : 'File a strike report'}
              </Button>
            </div>
          )
        ) : null}
      </section>

      <section aria-labelledby={`${id}-raised`} className="flex flex-col gap-3">
        <h3 id={`${id}-raised`} className="font-semibold">
          Plants raised from this bundle
        </h3>
        {raised ? (
          <Alert tone="success" title={`Registered ${raised.length === 1 ? '1 plant' : `${raised.length} plants`}`}>
            <RaisedList plants={raised} />
            <p className="mt-2">
              Each names {bundle.plant.code} as its parent and this bundle as where it came from.{' '}
              <Link to={paths.plantLabels(`ids=${raised.map((p) => p.id).join(',')}`)}>Print their labels</Link>.
            </p>
          </Alert>
        ) : null}
        {bundle.raisedPlants.length ? (
          <RaisedList plants={bundle.raisedPlants} />
        ) : (
          <p className="text-ink-soft">None registered yet. Rooted cuttings you keep can join the register as mother plants of your farm.</p>
        )}
        {bundle.mayRaise > 0 ? (
          farms.length === 0 ? (
            <p className="text-ink-soft">
              {whole(bundle.mayRaise)} rooted {bundle.mayRaise === 1 ? 'cutting is' : 'cuttings are'} not registered. Plants raised from a bundle go on a farm where you are
              farm lead or farm hand; you work on none, so ask the coordinator if your place should be a member farm.
            </p>
          ) : raising ? (
            <div className="rounded-lg border-2 border-leaf/40 bg-leaf-light/40 p-4">
              <h4 className="mb-3 font-semibold">Raise plants</h4>
              <RaisePlantsForm
                bundle={bundle}
                farms={farms}
                onChanged={onPlantsRaised}
                onRaised={(plants) => {
                  setRaised(plants);
                  setRaising(false);
                }}
              />
              <Button variant="quiet" size="sm" className="mt-2" onClick={() => setRaising(false)}>
                Not now
              </Button>
            </div>
          ) : (
            <div>
              <Button variant="secondary" onClick={() => setRaising(true)}>
                Raise plants
              </Button>
              <span className="ml-3 text-sm text-ink-soft">
                {whole(bundle.mayRaise)} rooted {bundle.mayRaise === 1 ? 'cutting' : 'cuttings'} not yet registered
              </span>
            </div>
          )
        ) : null}
      </section>

      <p className="text-sm">
        <Link to={paths.strikeRates({ speciesId: bundle.species.id })}>Strike rates for {bundle.species.name}</Link>
      </p>
    </article>
  );
}
