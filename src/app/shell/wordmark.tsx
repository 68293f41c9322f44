import { Link } from 'react-router-dom';
import { paths } from '../paths';

/** Heelwood's mark: a cutting with its heel of older wood, drawn in leaf and bark. */
export function Wordmark({ cooperativeName }: { cooperativeName?: string }) {
  return (
    <Link to={paths.home()} className="group inline-flex min-h-touch items-center gap-3 rounded-lg text-ink no-underline">
      <svg width="34" height="34" viewBox="0 0 34 34" aria-hidden="true" focusable="false" className="shrink-0">
        <path d="M17 31 L17 9" stroke="#6f543d" strokeWidth="3" strokeLinecap="round" />
        <path d="M17 31 q-5 -1 -7 -4" stroke="#6f543d" strokeWidth="3" strokeLinecap="round" fill="none" />
        <path d="M17 15 C 9 14, 6 8, 7 3 C 13 4, 17 8, 17 15 Z" fill="#2f6b34" />
        <path d="M17 20 C 24 19, 28 14, 28 9 C 22 9, 17 13, 17 20 Z" fill="#2f6b34" />
      </svg>
      <span className="flex flex-col leading-tight">
        <span className="text-xl font-bold tracking-tight group-hover:text-leaf-dark">Heelwood</span>
        {cooperativeName ? <span className="text-sm font-medium text-currant">{cooperativeName}</span> : null}
      </span>
    </Link>
  );
}
