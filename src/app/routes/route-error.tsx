import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { ApiError } from '../../lib/api-client';
import { paths } from '../paths';

function describe(error: unknown): { title: string; body: string } {
  if (isRouteErrorResponse(error) && error.status === 404) {
    return { title: 'Page not found', body: 'There is nothing at this address. It may have moved.' };
  }
  if (error instanceof ApiError) {
    if (error.status === 0) return { title: 'Heelwood cannot reach its server', body: error.message };
    if (error.status === 403) return { title: 'Not open to your account', body: error.message };
    return { title: 'This page could not load', body: error.message };
  }
  // A lazily loaded page that no longer exists after an update fails to import.
  if (error instanceof TypeError && /import|module/i.test(error.message)) {
    return { title: 'Heelwood was updated', body: 'Reload the page to get the new version.' };
  }
  return { title: 'Something went wrong on this page', body: 'Reload the page to try again. If it keeps happening, tell your coordinator what you were doing.' };
}

/** The error boundary for each route: says what happened and offers a way on. */
export function RouteError() {
  const error = useRouteError();
  const { title, body } = describe(error);
  if (import.meta.env.DEV) console.error(error);
  return (
    <div className="mx-auto max-w-xl px-4 py-10">
      <title>{`${title} · Heelwood`}</title>
      <h1 className="mb-4 text-2xl font-bold">{title}</h1>
      <Alert tone="danger">{body}</Alert>
      <div className="mt-6 flex flex-wrap items-center gap-4">
        <Button onClick={() => window.location.reload()}>Reload the page</Button>
        <Link to={paths.home()}>Go to the home page</Link>
      </div>
    </div>
  );
}
