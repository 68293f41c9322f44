// What happens when the server says the session is gone (a 401 on any /api call except
// /api/me): go to sign-in, come back to the same page afterwards, and forget cached data.
import type { QueryClient } from '@tanstack/react-query';
import { setUnauthorizedHandler } from '../lib/api-client';
import { paths, patterns } from './paths';

type Navigator = { navigate: (to: string, options?: { replace?: boolean }) => Promise<void> | void };

export function installSessionExpiryHandler(router: Navigator, queryClient: QueryClient): void {
  setUnauthorizedHandler(() => {
    const here = `${window.location.pathname}${window.location.search}`;
    const next = window.location.pathname.startsWith(patterns.signIn) ? undefined : here;
    void Promise.resolve(router.navigate(paths.signIn(next), { replace: true })).then(() => queryClient.clear());
  });
}
