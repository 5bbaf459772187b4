import { NavLink } from 'react-router';
import { cn } from '@/lib/cn';
import { PROJECT_TABS, TAB_GROUPS } from '../project-tabs';

/**
 * The project tab bar, read from PROJECT_TABS, in its groups (each with a small caption). A group never breaks;
 * where the row is too narrow the next group goes to a second row, so every tab stays in sight on a laptop. On a
 * phone the bar scrolls sideways instead.
 */
export function ProjectTabsNav() {
  return (
    <nav aria-label="Project" className="mt-4 overflow-x-auto border-b border-stone-200 sm:overflow-visible">
      <div className="flex min-w-max gap-x-5 gap-y-1 sm:min-w-0 sm:flex-wrap">
        {TAB_GROUPS.map((group) => (
          <section key={group} aria-label={group} className="flex flex-col">
            <h2 className="px-2 text-[11px] font-semibold tracking-wide text-stone-400 uppercase">{group}</h2>
            <ul className="flex">
              {PROJECT_TABS.filter((tab) => tab.group === group).map((tab) => (
                <li key={tab.path}>
                  <NavLink
                    to={tab.path}
                    end={tab.path === ''}
                    className={({ isActive }) =>
                      cn(
                        '-mb-px inline-block rounded-t border-b-2 px-2 py-2 text-sm font-medium whitespace-nowrap',
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
          </section>
        ))}
      </div>
    </nav>
  );
}
