import { useId, useState } from 'react';
import { NavLink, useLocation } from 'react-router-dom';
import { Icon, type IconName } from '@/components/ui/icons';

export type PhoneNavItem = { to: string; label: string };

/** The four places a technician goes with one thumb; everything else of the nav sits under More. */
const BAR: { to: string; label: string; icon: IconName }[] = [
  { to: '/round', label: 'Round', icon: 'round' },
  { to: '/', label: 'Find', icon: 'find' },
  { to: '/scan', label: 'Scan', icon: 'scan' },
];

const tab = 'flex min-h-[3.5rem] flex-1 flex-col items-center justify-center gap-0.5 text-sm font-semibold';

/** Shown below the sm breakpoint only; the desk keeps the full list in the header. */
export function PhoneNav({ items, extra = [] }: { items: PhoneNavItem[]; extra?: PhoneNavItem[] }) {
  const [open, setOpen] = useState(false);
  const { pathname } = useLocation();
  const sheetId = useId();

  const allowed = new Set(items.map((i) => i.to));
  const bar = BAR.filter((b) => allowed.has(b.to));
  const rest = [...items.filter((i) => !bar.some((b) => b.to === i.to)), ...extra];
  const moreActive = rest.some((i) => i.to !== '/' && pathname.startsWith(i.to));

  return (
    <nav aria-label="Shortcuts" className="no-print fixed inset-x-0 bottom-0 z-20 border-t-2 border-plate-line bg-header text-header-text sm:hidden">
      {open && (
        <ul id={sheetId} className="flex flex-col border-b border-header-soft py-1">
          {rest.map((item) => (
            <li key={item.to}>
              <NavLink to={item.to} onClick={() => setOpen(false)} className="flex min-h-tap items-center px-4 font-semibold hover:bg-header-soft">
                {item.label}
              </NavLink>
            </li>
          ))}
        </ul>
      )}
      <div className="flex">
        {bar.map((b) => (
          <NavLink
            key={b.to}
            to={b.to}
            end={b.to === '/'}
            onClick={() => setOpen(false)}
            className={({ isActive }) => `${tab} ${isActive ? 'bg-plate text-iron' : 'text-header-text/85'}`}
          >
            <Icon name={b.icon} className="h-5 w-5" />
            {b.label}
          </NavLink>
        ))}
        {rest.length > 0 && (
          <button
            type="button"
            aria-expanded={open}
            aria-controls={sheetId}
            onClick={() => setOpen(!open)}
            className={`${tab} ${open || moreActive ? 'bg-plate text-iron' : 'text-header-text/85'}`}
          >
            <Icon name="more" className="h-5 w-5" />
            More
          </button>
        )}
      </div>
    </nav>
  );
}
