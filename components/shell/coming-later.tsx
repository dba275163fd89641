import { PageHeader } from "@/components/ui/page-header";

/** An honest placeholder for a screen that is planned but not built: no invented content. */
export function ComingLater({ title, purpose }: { title: string; purpose: string }) {
  return (
    <>
      <PageHeader title={title} />
      <div className="max-w-2xl rounded-lg border border-dashed border-ink/20 bg-paper-raised px-5 py-6">
        <p className="font-medium">This part of Gyrolux arrives in a later release.</p>
        <p className="mt-2 text-ink-soft">{purpose}</p>
      </div>
    </>
  );
}
