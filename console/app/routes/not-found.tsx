import { Link } from 'react-router';
import { Wordmark } from '@console/components/brand/wordmark';
import { buttonClasses } from '@console/components/ui/button';
import { env } from '@console/config/env';
import { paths } from '@console/config/paths';

export default function NotFoundRoute() {
  return (
    <main className="mx-auto flex min-h-screen max-w-xl flex-col justify-center gap-6 px-6 py-12">
      <title>Page not found · Sweepline</title>
      <Wordmark tone="dark" />
      <div className="space-y-2">
        <p className="font-mono text-eyebrow font-semibold text-signal-800 uppercase">Error 404</p>
        <h1 className="text-3xl font-extrabold tracking-tight text-ink-900">Nothing measured at this address</h1>
        <p className="text-sm text-ink-600">
          The link may be out of date, or the page belongs to an organisation you are not signed in to.
        </p>
      </div>
      <div className="flex gap-3">
        <Link to={paths.app.root.getHref()} className={buttonClasses('primary')}>
          Go to the overview
        </Link>
        <a href={env.docsPath} className={buttonClasses('secondary')}>
          API reference
        </a>
      </div>
    </main>
  );
}
