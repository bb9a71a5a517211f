import { useRef, useState, type FormEvent } from 'react';
import { ProblemAlert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { TextField } from '@console/components/ui/field';
import { fieldErrorsFromProblem } from '@console/lib/problem-message';
import { fieldErrorsFromIssues, focusFirstInvalidField, type FieldErrors } from '@console/utils/form-errors';
import { friendlyZodError } from '@console/utils/validation-messages';
import type { CreatedWebhookEndpoint } from '@shared/schemas/webhooks';
import { createWebhookEndpointInputSchema, useCreateWebhookEndpoint } from '../api/create-webhook-endpoint';
import { EventTypeCheckboxes } from './event-type-checkboxes';

const DEFAULT_EVENTS = ['analysis.succeeded', 'analysis.failed'];

export function CreateWebhookEndpointForm({ onCreated }: { onCreated: (created: CreatedWebhookEndpoint) => void }) {
  const formRef = useRef<HTMLFormElement>(null);
  const idempotencyKey = useRef(crypto.randomUUID());
  const [selected, setSelected] = useState<ReadonlySet<string>>(new Set(DEFAULT_EVENTS));
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});

  const create = useCreateWebhookEndpoint({
    onSuccess: (created) => {
      formRef.current?.reset();
      setSelected(new Set(DEFAULT_EVENTS));
      idempotencyKey.current = crypto.randomUUID();
      onCreated(created);
    },
  });
  const errors = { ...fieldErrorsFromProblem(create.error), ...clientErrors };

  // Changed values are a new request, so they get a new Idempotency-Key.
  const renewIdempotencyKey = () => {
    idempotencyKey.current = crypto.randomUUID();
  };

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const data = new FormData(form);
    const description = String(data.get('description') ?? '').trim();
    const parsed = createWebhookEndpointInputSchema.safeParse(
      { url: String(data.get('url') ?? '').trim(), eventTypes: [...selected], ...(description ? { description } : {}) },
      { error: friendlyZodError },
    );
    if (!parsed.success) {
      const found = fieldErrorsFromIssues(parsed.error.issues);
      setClientErrors(found);
      focusFirstInvalidField(form, found);
      return;
    }
    setClientErrors({});
    create.mutate({ input: parsed.data, idempotencyKey: idempotencyKey.current });
  };

  return (
    <form ref={formRef} noValidate onSubmit={onSubmit} onChange={renewIdempotencyKey} className="space-y-6">
      {create.error && <ProblemAlert error={create.error} />}
      <div className="grid gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <TextField
          label="Receiver URL"
          name="url"
          type="url"
          inputMode="url"
          placeholder="https://rigs.kestrelbay.example/sweepline/events"
          hint="Where Sweepline POSTs each event. https in production; private and loopback addresses are refused there."
          error={errors.url}
          maxLength={2048}
          autoComplete="off"
          spellCheck={false}
        />
        <TextField
          label="Description (optional)"
          name="description"
          placeholder="Line 2 MES bridge"
          hint="Say which system listens here."
          error={errors.description}
          maxLength={200}
          autoComplete="off"
        />
      </div>
      <EventTypeCheckboxes
        selected={selected}
        error={errors.eventTypes}
        onToggle={(name, checked) =>
          setSelected((current) => {
            const next = new Set(current);
            if (checked) next.add(name);
            else next.delete(name);
            return next;
          })
        }
      />
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" isPending={create.isPending}>
          {create.isPending ? 'Creating endpoint…' : 'Create endpoint'}
        </Button>
        <p className="text-xs text-ink-500">The signing secret is shown once, right after creation.</p>
      </div>
    </form>
  );
}
