"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { ApiError, describeError } from "@/lib/query/fetcher";
import { useAddMember } from "@/lib/query/labs";
import type { LabRole } from "@/lib/query/types";
import { ROLE_LABEL, ROLE_MEANING, ROLES } from "./role-text";

export function AddMemberForm({ labId, labName }: { labId: string; labName: string }) {
  const add = useAddMember(labId);
  const [email, setEmail] = useState("");
  const [role, setRole] = useState<LabRole>("viewer");
  const [added, setAdded] = useState<string | null>(null);
  const emailError = add.error instanceof ApiError ? add.error.fields?.email : undefined;

  return (
    <form
      className="mt-4 rounded-lg border border-ink/10 bg-paper-raised p-4"
      aria-label={`Add a member to ${labName}`}
      onSubmit={(event) => {
        event.preventDefault();
        setAdded(null);
        add.mutate(
          { email: email.trim(), role },
          {
            onSuccess: () => {
              setAdded(email.trim());
              setEmail("");
            },
          },
        );
      }}
    >
      <h3 className="text-sm font-semibold">Add a member</h3>
      <div className="mt-2 flex flex-wrap items-end gap-3">
        <div className="w-full sm:w-72">
          <label htmlFor={`add-email-${labId}`} className="block text-sm font-medium">
            E-mail of the person
          </label>
          <input
            id={`add-email-${labId}`}
            type="email"
            required
            value={email}
            onChange={(event) => setEmail(event.target.value)}
            aria-invalid={emailError ? true : undefined}
            className={`mt-1 ${INPUT_CLASS}`}
          />
        </div>
        <div className="w-full sm:w-72">
          <label htmlFor={`add-role-${labId}`} className="block text-sm font-medium">
            Role
          </label>
          <select id={`add-role-${labId}`} value={role} onChange={(event) => setRole(event.target.value as LabRole)} className={`mt-1 ${INPUT_CLASS}`}>
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABEL[r]} — {ROLE_MEANING[r]}
              </option>
            ))}
          </select>
        </div>
        <Button type="submit" disabled={add.isPending || email.trim() === ""}>
          {add.isPending ? "Adding…" : "Add member"}
        </Button>
      </div>
      <p className="mt-2 text-xs text-ink-soft">The person needs a Gyrolux account with this e-mail address.</p>
      {add.isError ? (
        <p role="alert" className="mt-2 text-sm text-ember">
          {emailError ?? describeError(add.error)}
        </p>
      ) : null}
      {added ? (
        <p role="status" className="mt-2 text-sm text-lux-dark">
          Added {added}.
        </p>
      ) : null}
    </form>
  );
}
