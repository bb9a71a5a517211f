import { useEffect, useRef, type ReactNode } from 'react';
import { Link, useLocation } from 'react-router';
import { Wordmark } from '@console/components/brand/wordmark';
import { cn } from '@console/utils/cn';
import { SideNav, type NavSection } from './side-nav';

type AppShellProps = {
  navigation: NavSection[];
  /** Organisation picker, drawn under the wordmark. */
  organisationSlot: ReactNode;
  /** Who is signed in and the sign-out control, drawn at the foot of the sidebar. */
  accountSlot: ReactNode;
  children: ReactNode;
};

export function AppShell({ navigation, organisationSlot, accountSlot, children }: AppShellProps) {
  const mainRef = useRef<HTMLElement>(null);
  const { pathname } = useLocation();
  const firstRender = useRef(true);

  // After client-side navigation, move focus to the new page so keyboard and screen-reader users start there.
  useEffect(() => {
    if (firstRender.current) {
      firstRender.current = false;
      return;
    }
    mainRef.current?.focus({ preventScroll: false });
  }, [pathname]);

  return (
    <div className="min-h-screen lg:grid lg:grid-cols-[17rem_minmax(0,1fr)]">
      <a
        href="#main"
        className={cn(
          'sr-only z-50 rounded-md bg-signal-400 px-3 py-2 font-semibold text-ink-950',
          'focus:not-sr-only focus:fixed focus:top-3 focus:left-3',
        )}
      >
        Skip to content
      </a>
      <aside className="on-ink bg-ink-950 text-ink-200">
        <div className="flex flex-col gap-6 px-4 py-5 lg:sticky lg:top-0 lg:h-screen lg:overflow-y-auto">
          <Link to="/" className="self-start rounded-md px-2 py-1" aria-label="Sweepline overview">
            <Wordmark tone="light" />
          </Link>
          <div className="px-1">{organisationSlot}</div>
          <div className="flex-1">
            <SideNav sections={navigation} />
          </div>
          <div className="border-t border-ink-800 px-1 pt-4">{accountSlot}</div>
        </div>
      </aside>
      <div className="flex min-w-0 flex-col">
        <div className="sweep-rule h-1" aria-hidden="true" />
        <main
          id="main"
          ref={mainRef}
          tabIndex={-1}
          className="mx-auto w-full max-w-6xl flex-1 px-6 py-8 outline-none lg:px-10"
        >
          {children}
        </main>
      </div>
    </div>
  );
}
