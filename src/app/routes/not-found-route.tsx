import { paths } from '../paths';
import { ButtonLink } from '../../components/ui/button';

export function NotFoundRoute() {
  return (
    <div className="rounded-card border border-paper-edge bg-white/70 p-6 sm:p-8">
      <title>Page not found · Heelwood</title>
      <h1 className="text-2xl font-bold sm:text-3xl">Page not found</h1>
      <p className="mt-3 text-ink-soft">There is nothing at this address. Check the link, or start again from the home page.</p>
      <ButtonLink className="mt-6" to={paths.home()}>
        Go to the home page
      </ButtonLink>
    </div>
  );
}
