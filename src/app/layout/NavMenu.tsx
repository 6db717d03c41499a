import { NavLink } from 'react-router-dom';
import { navScreens } from '../screens';

const itemBase =
  'block whitespace-nowrap border-b-2 px-3 py-3 text-sm font-medium transition-colors ' +
  'lg:border-b-0 lg:border-l-4 lg:px-4 lg:py-2.5';
const itemIdle = 'border-transparent text-graphite-200 hover:bg-graphite-800 hover:text-paper-50';
const itemActive = 'border-copper-500 bg-graphite-800 text-copper-300';

/** The screens this user may open, as sent by /api/me: a top row on narrow screens, a left rail on wide. */
export function NavMenu({ permissions }: { permissions: readonly string[] }) {
  const visible = navScreens.filter((screen) => permissions.includes(screen.action));
  return (
    <nav aria-label="Screens" className="bg-graphite-900 lg:w-52 lg:shrink-0 lg:py-3">
      <ul className="flex overflow-x-auto lg:flex-col lg:overflow-visible">
        {visible.map((screen) => (
          <li key={screen.path}>
            <NavLink
              to={screen.path}
              className={({ isActive }) => `${itemBase} ${isActive ? itemActive : itemIdle}`}
            >
              {screen.title}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
