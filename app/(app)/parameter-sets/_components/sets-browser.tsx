"use client";

import { useSearchParams } from "next/navigation";
import { useCallback, useMemo } from "react";
import { Button, LinkButton } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { PageHeader } from "@/components/ui/page-header";
import { SkeletonRows } from "@/components/ui/skeleton";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { useSearchUpdate } from "@/components/ui/use-search-update";
import { useLabs } from "@/lib/query/labs";
import { LoadMore } from "@/components/ui/load-more";
import { useParameterSetPages } from "@/lib/query/parameter-sets";
import { roleAtLeast } from "@/lib/contracts/roles";
import { SearchBox } from "@/components/ui/search-box";
import { SetsTable } from "./sets-table";
import { parseSort, sortSets, type SortKey } from "./sort";
import { noun } from "@/lib/text/plural";

export function SetsBrowser() {
  const searchParams = useSearchParams();
  const update = useSearchUpdate();
  const q = searchParams.get("q") ?? "";
  const labId = searchParams.get("lab") ?? "";
  const tag = searchParams.get("tag") ?? "";
  const sort = parseSort(searchParams.get("sort"), searchParams.get("dir"));

  const labs = useLabs();
  const sets = useParameterSetPages({ labId, q, tag });
  const canCreate = labs.data?.some((lab) => roleAtLeast(lab.role, "editor")) ?? false;
  const filtered = q !== "" || labId !== "" || tag !== "";

  const sorted = useMemo(() => sortSets(sets.items, sort.key, sort.dir), [sets.items, sort.key, sort.dir]);
  const onSearch = useCallback((text: string) => update({ q: text }), [update]);
  const onSort = (key: SortKey) => {
    const dir = key === sort.key ? (sort.dir === "asc" ? "desc" : "asc") : key === "updated" ? "desc" : "asc";
    update({ sort: key, dir });
  };
  const onTag = (t: string) => update({ tag: t === tag ? null : t });
  const clearFilters = () => update({ q: null, lab: null, tag: null });

  return (
    <>
      <PageHeader
        title="Parameter sets"
        lead="Versioned model parameters of your labs. Every save keeps the previous version."
        actions={canCreate ? <LinkButton href="/parameter-sets/new">New parameter set</LinkButton> : null}
      />

      <div className="mb-4 flex flex-wrap items-end gap-4" role="search" aria-label="Filter parameter sets">
        <SearchBox id="sets-search" placeholder="Name or description" value={q} onSearch={onSearch} />
        <div className="w-full sm:w-60">
          <label htmlFor="sets-lab" className="block text-sm font-medium">
            Lab
          </label>
          <select id="sets-lab" value={labId} onChange={(event) => update({ lab: event.target.value })} className={`mt-1 ${INPUT_CLASS}`}>
            <option value="">All my labs</option>
            {labs.data?.map((lab) => (
              <option key={lab.id} value={lab.id}>
                {lab.name}
              </option>
            ))}
          </select>
        </div>
        {tag ? (
          <p className="flex items-center gap-2 pb-2 text-sm">
            Tag:
            <button
              type="button"
              onClick={() => update({ tag: null })}
              aria-label={`Remove tag filter ${tag}`}
              className="rounded-full border border-lux bg-lux px-2.5 py-0.5 text-xs text-white"
            >
              {tag} <span aria-hidden="true">×</span>
            </button>
          </p>
        ) : null}
        {sets.isFetching && !sets.isPending ? (
          <p className="pb-2 text-sm text-ink-soft" role="status">
            Updating…
          </p>
        ) : null}
      </div>

      {sets.isPending ? (
        <SkeletonRows label="Loading parameter sets" />
      ) : sets.isError ? (
        <ErrorPanel error={sets.error} retry={() => void sets.refetch()} />
      ) : sorted.length === 0 ? (
        <EmptyState filtered={filtered} canCreate={canCreate} noLab={labs.data?.length === 0} onClear={clearFilters} />
      ) : (
        <>
          <SetsTable items={sorted} sortKey={sort.key} sortDir={sort.dir} onSort={onSort} activeTag={tag} onTag={onTag} />
          <LoadMore
            shown={sorted.length}
            hasMore={sets.hasNextPage}
            loading={sets.isFetchingNextPage}
            onMore={() => void sets.fetchNextPage()}
            noun={noun("set")}
          />
        </>
      )}
    </>
  );
}

function EmptyState({
  filtered,
  canCreate,
  noLab,
  onClear,
}: {
  filtered: boolean;
  canCreate: boolean;
  /** The caller belongs to no lab (removed from their only one, say): the way forward is the Lab page. */
  noLab: boolean;
  onClear: () => void;
}) {
  return (
    <div className="rounded-lg border border-dashed border-ink/20 bg-paper-raised px-6 py-10 text-center">
      {noLab && !filtered ? (
        <>
          <p className="font-medium">You are not a member of any lab</p>
          <p className="mt-1 text-sm text-ink-soft">Create a personal lab on the Lab page, or ask a lab owner to invite you.</p>
          <LinkButton href="/lab" className="mt-4">
            Go to the Lab page
          </LinkButton>
        </>
      ) : filtered ? (
        <>
          <p className="font-medium">No parameter set matches these filters.</p>
          <p className="mt-1 text-sm text-ink-soft">Try other words, another lab or no tag.</p>
          <Button variant="secondary" className="mt-4" onClick={onClear}>
            Clear filters
          </Button>
        </>
      ) : (
        <>
          <p className="font-medium">No parameter sets yet</p>
          <p className="mt-1 text-sm text-ink-soft">
            {canCreate
              ? "Start from the terbium-garnet defaults and adjust them to your sample."
              : "An editor of your lab can create the first one; you will see it here."}
          </p>
          {canCreate ? (
            <LinkButton href="/parameter-sets/new" className="mt-4">
              Create a parameter set
            </LinkButton>
          ) : null}
        </>
      )}
    </div>
  );
}
