import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { DateTime } from "@/components/ui/date-time";
import { PageHeader } from "@/components/ui/page-header";
import { getSessionUser } from "@/lib/auth/access";
import { caughtMailVisible, listCaughtMail } from "@/lib/mail/caught";

export const metadata: Metadata = { title: "Caught mail" };
export const dynamic = "force-dynamic";

/** Site admins of a demo deployment read what the local SMTP stand-in caught. */
export default async function CaughtMailPage() {
  const user = await getSessionUser();
  if (user?.siteRole !== "admin" || !caughtMailVisible()) notFound();
  const { dir, items } = await listCaughtMail({ limit: 100 });
  return (
    <>
      <PageHeader
        title="Caught mail"
        lead={`The newest 100 messages the local mail catcher stored in ${dir}. Nothing here was delivered.`}
      />
      <p role="note" className="mb-4 rounded-lg border border-amber-700/40 bg-amber-50 px-4 py-3 text-sm text-amber-950">
        Demo deployment only. The links below are live: a reset or invitation link works for whoever opens it, until it is used or expires.
        Do not share this page or copy links out of it.
      </p>
      {items.length === 0 ? (
        <p className="rounded-lg border border-dashed border-ink/20 px-5 py-6">No mail caught yet.</p>
      ) : (
        <ul className="space-y-4">
          {items.map((mail) => (
            <li key={mail.id} className="rounded-lg border border-ink/10 bg-paper-raised p-4">
              <p className="text-sm text-ink-soft">
                <DateTime iso={mail.receivedAt} /> · to {mail.to.join(", ")}
              </p>
              <h2 className="mt-1 font-semibold">{mail.subject}</h2>
              <pre className="mt-2 text-sm break-words whitespace-pre-wrap">{mail.text}</pre>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
