import { useEffect, useId, useState } from 'react';
import { useLocation, useNavigate } from 'react-router-dom';
import type { Me } from '../../../shared/schemas/members';
import { useSignOut } from '../../features/auth/api/sign-out';
import { useCooperative } from '../../features/cooperative/api/get-cooperative';
import { Button } from '../../components/ui/button';
import { errorMessage } from '../../lib/api-client';
import { LABELS } from '../../../shared/domain';
import { navFor } from '../nav';
import { paths } from '../paths';
import { MainNav } from './main-nav';
import { Wordmark } from './wordmark';

function MenuIcon({ open }: { open: boolean }) {
  return (
    <svg width="22" height="22" viewBox="0 0 22 22" aria-hidden="true" focusable="false">
      {open ? (
        <path d="M4 4l14 14M18 4L4 18" stroke="currentColor" strokeWidth="2.4" strokeLinecap="round" />
      ) : (
        <path d="M3 6h16M3 11h16M3 16h16" stroke="currentColor" strokeWidth="2.4" strokeLinecap="round" />
      )}
    </svg>
  );
}

export function AppHeader({ me }: { me: Me }) {
  const cooperative = useCooperative();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const location = useLocation();
  const [menuOpen, setMenuOpen] = useState(false);
  const menuId = useId();
  const items = navFor(me);

  // A route change from anywhere (a link in the page, the back button) closes the phone menu.
  useEffect(() => setMenuOpen(false), [location.pathname]);

  const onSignOut = async () => {
    try {
      await signOut.mutateAsync();
      navigate(paths.signIn(), { replace: true });
    } catch {
      // Shown below from the mutation's error.
    }
  };

  const who = (
    <p className="text-sm leading-tight">
      <span className="font-semibold text-ink">{me.user.name}</span>
      <span className="block text-ink-soft">{LABELS.role[me.user.role]}</span>
    </p>
  );

  return (
    <header className="border-b border-paper-edge bg-paper-deep">
      <div className="mx-auto flex max-w-7xl items-center justify-between gap-4 px-4 py-2 sm:px-6">
        <Wordmark cooperativeName={cooperative.data?.name} />
        <div className="hidden items-center gap-4 lg:flex">
          {who}
          <Button variant="secondary" size="sm" onClick={onSignOut} busy={signOut.isPending}>
            Sign out
          </Button>
        </div>
        <button
          type="button"
          className="inline-flex min-h-touch items-center gap-2 rounded-lg border-2 border-bark-light px-3 font-semibold lg:hidden"
          aria-expanded={menuOpen}
          aria-controls={menuId}
          onClick={() => setMenuOpen((open) => !open)}
        >
          <MenuIcon open={menuOpen} />
          Menu
        </button>
      </div>
      {/* Its own row on wide screens: ten areas fit on one line there, beside the name they did not. */}
      <nav aria-label="Main" className="mx-auto hidden max-w-7xl px-2 pb-1 sm:px-4 lg:block">
        <MainNav items={items} orientation="row" />
      </nav>
      {signOut.isError ? (
        <p role="alert" className="mx-auto max-w-7xl px-4 pb-2 text-sm font-medium text-rust sm:px-6">
          Signing out did not work: {errorMessage(signOut.error)}
        </p>
      ) : null}
      <div id={menuId} hidden={!menuOpen} className="border-t border-paper-edge px-4 pb-4 pt-2 lg:hidden">
        <nav aria-label="Main">
          <MainNav items={items} orientation="column" onNavigate={() => setMenuOpen(false)} />
        </nav>
        <div className="mt-3 flex items-center justify-between gap-3 border-t border-paper-edge pt-3">
          {who}
          <Button variant="secondary" size="sm" onClick={onSignOut} busy={signOut.isPending}>
            Sign out
          </Button>
        </div>
      </div>
    </header>
  );
}
