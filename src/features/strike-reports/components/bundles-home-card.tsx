import { paths } from '../../../app/paths';
import { ButtonLink } from '../../../components/ui/button';
import { StatusBadge } from '../../../components/ui/status-badge';
import { plural } from '../../../lib/format';
import { useMyBundles } from '../api/get-my-bundles';
import { reportStatus } from '../lib/report-status';
import { todayIso } from '../lib/words';

/**
 * Home-page card for a member who has collected wood: the way to "My bundles", saying when
 * strike reports are due. The reminder e-mail sends people to the home page, so it starts here.
 */
export function BundlesHomeCard() {
  const mine = useMyBundles();
  const items = mine.data?.items ?? [];
  if (items.length === 0) return null;
  const today = todayIso();
  const due = items.filter((b) => reportStatus(b, today).kind === 'report_due').length;
  const raisable = items.reduce((n, b) => n + (mine.data?.farms.length ? b.mayRaise : 0), 0);
  return (
    <section aria-labelledby="home-bundles-title" className="rounded-card border border-currant/40 bg-currant-light/50 p-5 sm:p-6">
      <h2 id="home-bundles-title" className="mb-2 flex flex-wrap items-center gap-2 text-lg font-semibold">
        {due ? 'Strike reports due' : 'Your collected bundles'}
        {due ? <StatusBadge status="report_due" /> : null}
      </h2>
      <p className="mb-3">
        {due
          ? `A strike report is due on ${plural(due, 'bundle')} you collected: count the cuttings that rooted and report them. `
          : `${plural(items.length, 'collected bundle')}, with their strike reports. `}
        {raisable ? `${plural(raisable, 'rooted cutting')} can be registered as new mother plants.` : ''}
      </p>
      <ButtonLink to={paths.myBundles()}>My bundles</ButtonLink>
    </section>
  );
}
