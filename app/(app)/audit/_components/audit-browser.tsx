"use client";

import { useState } from "react";
import { DateTime } from "@/components/ui/date-time";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadMore } from "@/components/ui/load-more";
import { SkeletonRows } from "@/components/ui/skeleton";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { useLabMembers, useLabs } from "@/lib/query/labs";
import { useParameterSets } from "@/lib/query/parameter-sets";
import { useAudit } from "@/lib/query/sharing";
import { AUDIT_KINDS, canReadAnyAudit } from "@/lib/contracts/audit";
import { AUDIT_KIND_LABEL, auditDetailText, describeAuditEntry } from "@/lib/text/audit";
import { noun } from "@/lib/text/plural";

const KINDS = [{ value: "", label: "Everything" }, ...AUDIT_KINDS.map((k) => ({ value: k, label: AUDIT_KIND_LABEL[k] }))];

export function AuditBrowser() {
  const labs = useLabs();
  const owned = (labs.data ?? []).filter((lab) => canReadAnyAudit([lab.role]));
  const [labId, setLabId] = useState("");
  const chosen = labId || owned[0]?.id || "";
  const [filters, setFilters] = useState({ setId: "", actorId: "", subjectId: "", kind: "", from: "", to: "" });
  const sets = useParameterSets({ labId: chosen || undefined });
  const members = useLabMembers(chosen || null);
  const audit = useAudit(chosen, filters);
  const set = (key: keyof typeof filters) => (event: React.ChangeEvent<HTMLSelectElement | HTMLInputElement>) =>
    setFilters((f) => ({ ...f, [key]: event.target.value }));

  if (labs.isPending) return <SkeletonRows label="Loading your labs" rows={3} />;
  if (labs.isError) return <ErrorPanel error={labs.error} retry={() => void labs.refetch()} />;
  if (owned.length === 0)
    return (
      <p className="rounded-lg border border-dashed border-ink/20 px-5 py-6">You own no lab, so there is no audit trail for you to read.</p>
    );

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-3" role="search" aria-label="Filter the audit trail">
        <Select
          id="audit-lab"
          label="Lab"
          value={chosen}
          onChange={(e) => setLabId(e.target.value)}
          options={owned.map((lab) => ({ value: lab.id, label: lab.name }))}
        />
        <Select
          id="audit-set"
          label="Parameter set"
          value={filters.setId}
          onChange={set("setId")}
          options={[{ value: "", label: "All sets" }, ...(sets.data ?? []).map((s) => ({ value: s.id, label: s.name }))]}
        />
        <Select
          id="audit-person"
          label="Done by"
          value={filters.actorId}
          onChange={set("actorId")}
          options={[{ value: "", label: "Everyone" }, ...members.items.map((m) => ({ value: m.userId, label: m.name }))]}
        />
        <Select
          id="audit-subject"
          label="About person"
          value={filters.subjectId}
          onChange={set("subjectId")}
          options={[{ value: "", label: "Anyone" }, ...members.items.map((m) => ({ value: m.userId, label: m.name }))]}
        />
        <Select
          id="audit-kind"
          label="Kind"
          value={filters.kind}
          onChange={set("kind")}
          options={KINDS.map((k) => ({ value: k.value, label: k.label }))}
        />
        <DateInput id="audit-from" label="From (UTC day)" value={filters.from} onChange={set("from")} />
        <DateInput id="audit-to" label="To (UTC day)" value={filters.to} onChange={set("to")} />
      </div>
      {audit.isPending ? (
        <SkeletonRows label="Loading the audit trail" rows={5} />
      ) : audit.isError ? (
        <ErrorPanel error={audit.error} retry={() => void audit.refetch()} />
      ) : audit.items.length === 0 ? (
        <p className="rounded-lg border border-dashed border-ink/20 px-5 py-6 text-sm">Nothing recorded matches these filters.</p>
      ) : (
        <div className="relative overflow-x-auto rounded-lg border border-ink/10 bg-paper-raised">
          <table className="w-full text-sm">
            <caption className="sr-only">Audit trail</caption>
            <thead className="border-b border-ink/10 bg-paper-sunk/70">
              <tr>
                <th scope="col" className="px-3 py-2 text-left font-semibold">
                  When
                </th>
                <th scope="col" className="px-3 py-2 text-left font-semibold">
                  Who
                </th>
                <th scope="col" className="px-3 py-2 text-left font-semibold">
                  What
                </th>
                <th scope="col" className="px-3 py-2 text-left font-semibold">
                  Details
                </th>
              </tr>
            </thead>
            <tbody className="divide-y divide-ink/10">
              {audit.items.map((entry) => (
                <tr key={entry.id}>
                  <td className="px-3 py-2 whitespace-nowrap">
                    <DateTime iso={entry.at} />
                  </td>
                  <td className="px-3 py-2">{entry.actor?.name ?? "Gyrolux"}</td>
                  <td className="px-3 py-2">{describeAuditEntry(entry)}</td>
                  <td className="px-3 py-2 text-ink-soft">{auditDetailText(entry)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <div className="px-3 pb-3">
            <LoadMore
              shown={audit.items.length}
              hasMore={audit.hasNextPage}
              loading={audit.isFetchingNextPage}
              onMore={() => void audit.fetchNextPage()}
              noun={noun("entry", "entries")}
            />
          </div>
        </div>
      )}
    </div>
  );
}

function Select(props: {
  id: string;
  label: string;
  value: string;
  onChange: (e: React.ChangeEvent<HTMLSelectElement>) => void;
  options: { value: string; label: string }[];
}) {
  return (
    <div className="w-full sm:w-52">
      <label htmlFor={props.id} className="block text-sm font-medium">
        {props.label}
      </label>
      <select id={props.id} value={props.value} onChange={props.onChange} className={`mt-1 ${INPUT_CLASS}`}>
        {props.options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}

function DateInput(props: { id: string; label: string; value: string; onChange: (e: React.ChangeEvent<HTMLInputElement>) => void }) {
  return (
    <div className="w-full sm:w-44">
      <label htmlFor={props.id} className="block text-sm font-medium">
        {props.label}
      </label>
      <input id={props.id} type="date" value={props.value} onChange={props.onChange} className={`mt-1 ${INPUT_CLASS}`} />
    </div>
  );
}
