"use client";

import { useState } from "react";
import { createTokenAction, revokeTokenAction } from "@/app/(app)/profile/tokens/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Button, Field, Input } from "@/components/ui";

type Created = { id: string; name: string; token: string };

/** Names a new token and shows its secret once, with a copy button. */
export function CreateTokenForm({ origin }: { origin: string }) {
  const { state, formAction, errorOf, valueOf } = useFormAction(createTokenAction, { toastOnSuccess: false });
  const created = state.status === "ok" ? (state.data as Created | undefined) : undefined;
  const [copied, setCopied] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-4">
      <form action={formAction} noValidate className="flex flex-col gap-3 md:flex-row md:items-end" key={created?.id ?? "new"}>
        <Field label="Token name" hint="What will use it, e.g. the finance system's nightly ledger pull." error={errorOf("name")} required id="token-name" className="md:w-96">
          <Input name="name" maxLength={80} defaultValue={created ? "" : valueOf("name")} autoComplete="off" />
        </Field>
        <SubmitButton>Create token</SubmitButton>
      </form>
      {state.status === "error" && <FormStatus state={state} testId="token-status" />}
      {created && (
        <section aria-labelledby="new-token-title" className="flex flex-col gap-2 rounded-lg border-2 border-ok bg-ok-soft p-4 text-ok-ink" data-testid="new-token">
          <h3 id="new-token-title" className="font-semibold">
            Token &ldquo;{created.name}&rdquo; is ready. Copy it now: it is shown only this once.
          </h3>
          <div className="flex flex-wrap items-center gap-2">
            <code className="rounded border border-line-strong bg-surface-raised px-2 py-1 font-mono text-sm break-all text-ink" data-testid="new-token-secret">
              {created.token}
            </code>
            <Button
              type="button"
              size="sm"
              variant="secondary"
              onClick={async () => {
                await navigator.clipboard?.writeText(created.token).catch(() => undefined);
                setCopied(created.id);
              }}
            >
              {copied === created.id ? "Copied" : "Copy"}
            </Button>
          </div>
          <p className="text-sm">
            Send it as a bearer token, for example:{" "}
            <code className="font-mono break-all">
              curl -H &quot;Authorization: Bearer {created.token.slice(0, 12)}…&quot; &quot;{origin}/api/costs/export?format=csv&quot;
            </code>
          </p>
        </section>
      )}
    </div>
  );
}

/** Revokes one token at once. */
export function RevokeTokenButton({ id, name }: { id: string; name: string }) {
  const { state, formAction } = useFormAction(revokeTokenAction);
  return (
    <form action={formAction} className="flex flex-col items-end gap-1">
      <input type="hidden" name="id" value={id} />
      <SubmitButton size="sm" variant="danger" aria-label={`Revoke the token ${name}`}>
        Revoke
      </SubmitButton>
      {state.status === "error" && <FormStatus state={state} testId={`revoke-status-${id}`} />}
    </form>
  );
}
