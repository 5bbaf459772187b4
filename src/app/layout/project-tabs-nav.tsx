import { NavLink } from 'react-router';
import { cn } from '@/lib/cn';
import { PROJECT_TABS } from '../project-tabs';

/** The project tab bar, read from PROJECT_TABS; tabs still to come are dimmed but reachable. */
export function ProjectTabsNav() {
  return (
    <nav aria-label="Project" className="relative mt-4 overflow-x-auto border-b border-stone-200">
      <ul className="flex min-w-max gap-1">
        {PROJECT_TABS.map((tab) => (
          <li key={tab.path}>
            <NavLink
              to={tab.path}
              end={tab.path === ''}
              className={({ isActive }) =>
                cn(
                  '-mb-px inline-block rounded-t border-b-2 px-3 py-2 text-sm font-medium',
                  isActive
                    ? 'border-spruce-700 text-spruce-900'
                    : 'border-transparent text-stone-600 hover:border-stone-300 hover:text-stone-900',
                  !tab.screen && !isActive && 'font-normal text-stone-500',
                )
              }
            >
              {tab.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
