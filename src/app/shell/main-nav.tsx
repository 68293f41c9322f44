import { NavLink } from 'react-router-dom';
import { cn } from '../../lib/cn';
import type { NavItem } from '../nav';

export function MainNav({ items, onNavigate, orientation }: { items: NavItem[]; onNavigate?: () => void; orientation: 'row' | 'column' }) {
  if (items.length === 0) return null;
  return (
    <ul className={cn('flex gap-1', orientation === 'column' ? 'flex-col' : 'flex-row flex-wrap')}>
      {items.map((item) => (
        <li key={item.to}>
          <NavLink
            to={item.to}
            end={item.end}
            onClick={onNavigate}
            className={({ isActive }) =>
              cn(
                'flex min-h-touch items-center rounded-lg px-4 font-semibold no-underline',
                // The current page is marked by an underline bar as well as colour.
                isActive ? 'bg-currant-light text-currant underline decoration-2 underline-offset-8' : 'text-ink hover:bg-paper',
              )
            }
          >
            {item.label}
          </NavLink>
        </li>
      ))}
    </ul>
  );
}
