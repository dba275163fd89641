import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { DateTime } from "@/components/ui/date-time";
import { PageHeader } from "@/components/ui/page-header";
import { getSessionUser } from "@/lib/auth/access";
import { listCaughtMail } from "@/lib/mail/caught";
import { mailSettings } from "@/lib/mail/send";

export const metadata: Metadata = { title: "Caught mail" };
export const dynamic = "force-dynamic";

/** Site admins read what the local SMTP stand-in caught (demo and development only). */
export default async function CaughtMailPage() {
  const user = await getSessionUser();
  // Only while mail goes to the local catcher: a real relay's messages are nobody's to read here.
  const local = mailSettings.host === "127.0.0.1" || mailSettings.host === "localhost";
  if (user?.siteRole !== "admin" || !local) notFound();
  const { dir, items } = await listCaughtMail({ limit: 100 });
  return (
    <>
      <PageHeader
        title="Caught mail"
        lead={`The newest 100 messages the local mail catcher stored in ${dir}. Nothing here was delivered.`}
      />
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
