import Link from "next/link";
import { DateTime } from "@/components/ui/date-time";
import { PageHeader } from "@/components/ui/page-header";
import type { ParameterSet } from "@/lib/contracts/parameter-sets";

const ROLE_TEXT = {
  owner: "You are an owner of this lab",
  editor: "You can edit",
  viewer: "You can view; editing needs the editor role",
} as const;

/** Title, provenance and the links shared by the detail and history pages. */
export function SetHeader({ item, current }: { item: ParameterSet; current: "detail" | "history" }) {
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm">
        <Link href="/parameter-sets" className="text-lux-dark underline underline-offset-4">
          Parameter sets
        </Link>
        {current === "history" ? (
          <>
            {" / "}
            <Link href={`/parameter-sets/${item.id}`} className="text-lux-dark underline underline-offset-4">
              {item.name}
            </Link>
          </>
        ) : null}
      </nav>
      <PageHeader
        title={current === "history" ? `History of ${item.name}` : item.name}
        lead={
          <>
            {item.labName} · <span className="tabular-nums">version {item.version}</span> · updated <DateTime iso={item.updatedAt} />
            {" by "}
            {item.updatedBy.name}
            <span className="block text-sm">{ROLE_TEXT[item.role]}.</span>
          </>
        }
        actions={
          <>
            {current === "detail" ? (
              <Link
                href={`/parameter-sets/${item.id}/history`}
                className="rounded-md px-2 py-1 text-sm font-medium text-lux-dark underline-offset-4 hover:underline"
              >
                History
              </Link>
            ) : null}
            <Link
              href={`/workbench/${item.id}`}
              className="rounded-md px-2 py-1 text-sm font-medium text-lux-dark underline-offset-4 hover:underline"
            >
              Open in workbench
            </Link>
            <Link
              href={`/planner?setId=${item.id}`}
              className="rounded-md px-2 py-1 text-sm font-medium text-lux-dark underline-offset-4 hover:underline"
            >
              Plan measurements
            </Link>
            <Link
              href={`/parameter-sets/${item.id}/report`}
              className="rounded-md px-2 py-1 text-sm font-medium text-lux-dark underline-offset-4 hover:underline"
            >
              Printable report
            </Link>
          </>
        }
      />
    </>
  );
}
