"use client";

import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { RequestError, describeError } from "@/lib/query/fetcher";
import { useCreateToken, type CreatedToken } from "@/lib/query/tokens";

export function CreateTokenForm() {
  const create = useCreateToken();
  const [name, setName] = useState("");
  const [created, setCreated] = useState<CreatedToken | null>(null);
  const nameError = create.error instanceof RequestError ? create.error.fields?.name : undefined;

  return (
    <div className="mt-4 space-y-4">
      <form
        className="flex flex-wrap items-end gap-3 rounded-lg border border-ink/10 bg-paper-raised p-4"
        onSubmit={(event) => {
          event.preventDefault();
          setCreated(null);
          create.mutate(name.trim(), {
            onSuccess: (result) => {
              setCreated(result);
              setName("");
            },
          });
        }}
      >
        <div className="w-full sm:w-72">
          <label htmlFor="token-name" className="block text-sm font-medium">
            Token name
          </label>
          <input
            id="token-name"
            value={name}
            required
            maxLength={100}
            placeholder="e.g. fitting notebook"
            onChange={(event) => setName(event.target.value)}
            aria-invalid={nameError ? true : undefined}
            aria-describedby={create.isError ? "token-error" : undefined}
            className={`mt-1 ${INPUT_CLASS}`}
          />
        </div>
        <Button type="submit" disabled={create.isPending || name.trim() === ""}>
          {create.isPending ? "Creating…" : "Create token"}
        </Button>
        {create.isError ? (
          <p id="token-error" role="alert" className="w-full text-sm text-ember">
            {nameError ?? describeError(create.error)}
          </p>
        ) : null}
      </form>
      {created ? <NewTokenNotice created={created} onDone={() => setCreated(null)} /> : null}
    </div>
  );
}

function NewTokenNotice({ created, onDone }: { created: CreatedToken; onDone: () => void }) {
  const [copied, setCopied] = useState<"no" | "yes" | "failed">("no");
  return (
    <Alert tone="warning" title={`Copy the token “${created.item.name}” now`}>
      <p>It will not be shown again: Gyrolux keeps only a fingerprint of it. If you lose it, revoke it and create a new one.</p>
      <div className="mt-3 flex flex-wrap items-center gap-2">
        <label htmlFor="new-token" className="sr-only">
          New API token
        </label>
        <input
          id="new-token"
          readOnly
          value={created.token}
          onFocus={(event) => event.target.select()}
          className={`max-w-full flex-1 font-mono text-xs ${INPUT_CLASS}`}
        />
        <Button
          variant="secondary"
          onClick={() => {
            navigator.clipboard.writeText(created.token).then(
              () => setCopied("yes"),
              () => setCopied("failed"),
            );
          }}
        >
          Copy
        </Button>
        <Button variant="quiet" onClick={onDone}>
          I have stored it
        </Button>
      </div>
      <p aria-live="polite" className="mt-2 text-xs">
        {copied === "yes"
          ? "Copied to the clipboard."
          : copied === "failed"
            ? "The browser refused the clipboard; select the text and copy it by hand."
            : ""}
      </p>
    </Alert>
  );
}
