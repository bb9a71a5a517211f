import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { paths } from '@console/config/paths';
import { quickStartCurl, VERIFY_WEBHOOK_COMMANDS } from '../utils/quick-start';
import { nodeWebhookVerifier } from '../utils/rig-examples';
import { CodeBlock } from './code-block';

const linkClasses = 'font-semibold text-ink-800 underline underline-offset-2 hover:text-ink-950';

function Step({ number, title, children }: { number: number; title: string; children: ReactNode }) {
  return (
    <li className="grid grid-cols-[2rem_minmax(0,1fr)] gap-x-3">
      <span
        aria-hidden="true"
        className="flex size-7 items-center justify-center rounded-full bg-ink-800 font-mono text-xs font-bold text-signal-300"
      >
        {number}
      </span>
      <div className="min-w-0 space-y-3">
        <h3 className="pt-1 text-sm font-bold text-ink-900">
          <span className="sr-only">Step {number}: </span>
          {title}
        </h3>
        {children}
      </div>
    </li>
  );
}

type QuickStartStepsProps = { baseUrl: string; canManageKeys: boolean; canManageWebhooks: boolean };

export function QuickStartSteps({ baseUrl, canManageKeys, canManageWebhooks }: QuickStartStepsProps) {
  return (
    <ol className="space-y-8">
      <Step number={1} title="Create an API key">
        <p className="text-sm text-ink-700">
          {canManageKeys ? (
            <>
              Open <Link to={paths.app.apiKeys.getHref()} className={linkClasses}>API keys</Link> and create one key per
              rig with the scopes it needs (captures:write, analyses:write and analyses:read for the whole loop). The
              secret is shown once: put it in the rig’s environment as SWEEPLINE_API_KEY.
            </>
          ) : (
            <>Ask an owner or admin of your organisation for a key with the scopes the rig needs; they create keys under API keys.</>
          )}
        </p>
      </Step>
      <Step number={2} title="Call the API with curl">
        <p className="text-sm text-ink-700">
          This organisation’s base URL is <span className="font-mono text-xs text-ink-900" data-testid="base-url">{baseUrl}</span>.
          Every request carries the key as a bearer token; every POST that creates something carries an Idempotency-Key,
          so a retried request is answered once.
        </p>
        <CodeBlock code={quickStartCurl(baseUrl)} label="curl quick start" />
      </Step>
      <Step number={3} title="Verify a webhook signature">
        <p className="text-sm text-ink-700">
          Each delivery is signed as Standard Webhooks v1.0.0: webhook-signature is
          <span className="font-mono text-xs"> v1,</span>base64 of HMAC-SHA256 over
          <span className="font-mono text-xs"> {'{webhook-id}.{webhook-timestamp}.{raw body}'}</span>, keyed with the
          base64 bytes after <span className="font-mono text-xs">whsec_</span>. Check it on the raw body before parsing,
          compare in constant time, refuse timestamps more than 5 minutes off and deduplicate on webhook-id.
          {canManageWebhooks && (
            <>
              {' '}
              Endpoints and their secrets are under <Link to={paths.app.webhooks.getHref()} className={linkClasses}>Webhooks</Link>.
            </>
          )}
        </p>
        <CodeBlock code={VERIFY_WEBHOOK_COMMANDS} label="webhook verification command" />
        <CodeBlock code={nodeWebhookVerifier()} label="Node signature verifier from rig-loop.mjs" maxHeightClass="max-h-72" />
      </Step>
    </ol>
  );
}
