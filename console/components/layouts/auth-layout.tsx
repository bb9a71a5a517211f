import type { ReactNode } from 'react';
import { Wordmark } from '@console/components/brand/wordmark';
import { ResponseSketch } from '@console/components/brand/response-sketch';

type AuthLayoutProps = { title: string; lead: ReactNode; children: ReactNode; footer?: ReactNode };

/** Sign-in and sign-up: what Sweepline is on the left, the form on the right. */
export function AuthLayout({ title, lead, children, footer }: AuthLayoutProps) {
  return (
    <div className="grid min-h-screen lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
      <title>{`${title} · Sweepline`}</title>
      <aside className="on-ink relative hidden flex-col justify-between overflow-hidden bg-ink-950 px-12 py-10 text-ink-200 lg:flex">
        <Wordmark tone="light" />
        <div className="space-y-6">
          <ResponseSketch className="w-full max-w-md text-ink-700" />
          <div className="max-w-md space-y-3">
            <p className="text-2xl leading-snug font-bold text-white">
              Frequency response, sensitivity and THD from your rig&apos;s captures, with every convention stated.
            </p>
            <p className="text-sm text-ink-300">
              Post a WAV capture or a spectrum from the test bench; Sweepline returns the curves and figures your
              production line and your lab reports need.
            </p>
          </div>
        </div>
        <p className="font-mono text-xs text-ink-400">Measurement analysis API · developer console</p>
      </aside>
      <main className="flex flex-col justify-center px-6 py-10 sm:px-12">
        <div className="mx-auto w-full max-w-md space-y-8">
          <div className="lg:hidden">
            <Wordmark tone="dark" />
          </div>
          <header className="space-y-2">
            <h1 className="text-2xl font-extrabold tracking-tight text-ink-900">{title}</h1>
            <div className="text-sm text-ink-600">{lead}</div>
          </header>
          {children}
          {footer && <div className="border-t border-ink-200 pt-5 text-sm text-ink-600">{footer}</div>}
        </div>
      </main>
    </div>
  );
}
