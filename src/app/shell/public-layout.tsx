import { Outlet } from 'react-router-dom';
import { useCooperative } from '../../features/cooperative/api/get-cooperative';
import { MAIN_ID, SkipLink } from './skip-link';
import { Wordmark } from './wordmark';

/** Pages for people who are not signed in: sign-in, applying, passwords, not found. */
export function PublicLayout() {
  const cooperative = useCooperative();
  return (
    <div className="flex min-h-screen flex-col">
      <SkipLink />
      <header className="border-b border-paper-edge bg-paper-deep">
        <div className="mx-auto flex max-w-5xl items-center px-4 py-3 sm:px-6">
          <Wordmark cooperativeName={cooperative.data?.name} />
        </div>
      </header>
      <main id={MAIN_ID} tabIndex={-1} className="mx-auto w-full max-w-xl flex-1 px-4 py-8 sm:px-6 sm:py-12">
        <Outlet />
      </main>
      <footer className="px-4 py-6 text-center text-sm text-ink-faint">
        {cooperative.data ? `${cooperative.data.name} · ${cooperative.data.region}` : 'Heelwood'}
      </footer>
    </div>
  );
}

/** The card a public form sits on. */
export function PublicPage({ title, lead, children }: { title: string; lead?: string; children: React.ReactNode }) {
  return (
    <div className="rounded-card border border-paper-edge bg-white/70 p-6 sm:p-8">
      <title>{`${title} · Heelwood`}</title>
      <h1 className="text-2xl font-bold tracking-tight sm:text-3xl">{title}</h1>
      {lead ? <p className="mt-2 text-ink-soft">{lead}</p> : null}
      <div className="mt-6">{children}</div>
    </div>
  );
}
