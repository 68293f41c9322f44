import { Link } from 'react-router-dom';
import { paths } from '../../../app/paths';
import { Alert } from '../../../components/ui/alert';
import { ButtonLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { PageHeader } from '../../../components/ui/page-header';
import { errorMessage } from '../../../lib/api-client';
import { plural } from '../../../lib/format';
import { useMyBundles } from '../api/get-my-bundles';
import { reportStatus } from '../lib/report-status';
import { todayIso } from '../lib/words';
import { BundleCard, type BundleCallbacks } from './bundle-card';
import { ReportCautions } from './report-cautions';

function Header() {
  return (
    <PageHeader
      title="My bundles"
      lead="The wood you collected, and how it rooted. A strike report says how many cuttings you stuck and how many rooted; every report makes the strike rates the planner uses more honest for everyone."
      actions={
        <ButtonLink variant="secondary" to={paths.strikeRates()}>
          Strike rates
        </ButtonLink>
      }
    />
  );
}

/** The signed-in grower's collected bundles with their strike reports and plants raised. */
export function MyBundlesPage(callbacks: BundleCallbacks) {
  const mine = useMyBundles();
  const today = todayIso();

  if (mine.isPending) {
    return (
      <>
        <Header />
        <Loading label="Loading your bundles…" />
      </>
    );
  }
  if (mine.isError) {
    return (
      <>
        <Header />
        <Alert tone="danger" title="Your bundles did not load">
          {errorMessage(mine.error)} Reload the page to try again.
        </Alert>
      </>
    );
  }

  const { items, farms } = mine.data;
  if (items.length === 0) {
    return (
      <>
        <Header />
        <EmptyState
          title="No collected bundles yet"
          action={
            <ButtonLink variant="secondary" to={paths.seasons()}>
              Seasons
            </ButtonLink>
          }
        >
          Bundles appear here once the farm marks them collected. Ask for wood in a season that takes requests; after you stick the cuttings, come back here to
          report how many rooted.
        </EmptyState>
      </>
    );
  }

  const due = items.filter((b) => reportStatus(b, today).kind === 'report_due').length;
  return (
    <>
      <Header />
      <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,1fr)]">
        <div className="flex min-w-0 flex-col gap-4">
          <p className={due ? 'font-medium' : 'text-ink-soft'}>
            {plural(items.length, 'collected bundle')}
            {due ? `; a strike report is due on ${plural(due, 'of them', 'of them')}.` : '.'}
          </p>
          <ul className="flex flex-col gap-4" aria-label="Collected bundles">
            {items.map((b) => (
              <li key={b.id}>
                <BundleCard bundle={b} farms={farms} today={today} {...callbacks} />
              </li>
            ))}
          </ul>
        </div>
        <div className="flex flex-col gap-4">
          <ReportCautions />
          <section className="rounded-card border border-paper-edge bg-white/60 p-5 text-sm" aria-labelledby="how-reports-count">
            <h2 id="how-reports-count" className="mb-2 text-base font-semibold">
              How reports are used
            </h2>
            <p>
              Reports are pooled by species, variety and treatment. Each updates the reference rate the planner starts from; the{' '}
              <Link to={paths.strikeRates()}>strike-rate table</Link> shows the estimate and how sure it is.
            </p>
            <p className="mt-2">Count cuttings that rooted or show new growth. Cuttings you never stuck do not belong in a report.</p>
          </section>
        </div>
      </div>
    </>
  );
}
