import { NavLink } from 'react-router';
import { Icon, type IconName } from '@console/components/ui/icons';
import { cn } from '@console/utils/cn';

export type NavItem = {
  label: string;
  icon: IconName;
  /** A console path, or a server page (docs) when `external` is set. */
  to: string;
  end?: boolean;
  external?: boolean;
};

export type NavSection = { label: string; items: NavItem[] };

const itemClasses = 'group flex items-center gap-3 rounded-md px-3 py-2 text-sm font-semibold transition-colors';

// The active entry carries a thin signal-coloured bar at its left edge.
const activeClasses = cn(
  'bg-ink-800 text-white',
  'before:absolute before:inset-y-1.5 before:left-0 before:w-0.5 before:rounded-full before:bg-signal-400',
);

export function SideNav({ sections }: { sections: NavSection[] }) {
  return (
    <nav aria-label="Console" className="flex flex-col gap-6">
      {sections.map((section) => (
        <div key={section.label} className="flex flex-col gap-1">
          <p className="px-3 pb-1 font-mono text-eyebrow font-semibold text-ink-400 uppercase">{section.label}</p>
          <ul className="flex flex-col gap-0.5">
            {section.items.map((item) => (
              <li key={item.to}>
                {item.external ? (
                  <a href={item.to} className={cn(itemClasses, 'text-ink-200 hover:bg-ink-800 hover:text-white')}>
                    <Icon name={item.icon} className="text-ink-400 group-hover:text-signal-300" />
                    <span className="flex-1">{item.label}</span>
                    <Icon name="external" className="size-4 text-ink-500" />
                  </a>
                ) : (
                  <NavLink
                    to={item.to}
                    end={item.end}
                    className={({ isActive }) =>
                      cn(
                        itemClasses,
                        'relative',
                        isActive
                          ? activeClasses
                          : 'text-ink-200 hover:bg-ink-800/70 hover:text-white',
                      )
                    }
                  >
                    {({ isActive }) => (
                      <>
                        <Icon
                          name={item.icon}
                          className={isActive ? 'text-signal-400' : 'text-ink-400 group-hover:text-signal-300'}
                        />
                        <span>{item.label}</span>
                      </>
                    )}
                  </NavLink>
                )}
              </li>
            ))}
          </ul>
        </div>
      ))}
    </nav>
  );
}
