import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-6 py-24">
      <p className="text-sm font-medium tracking-wide text-lux uppercase">Not found</p>
      <h1 className="mt-2 text-2xl font-semibold">There is nothing at this address</h1>
      <p className="mt-3 text-ink-soft">
        The page may have moved, or the item was deleted or belongs to a lab you are not a member of.
      </p>
      <Link href="/parameter-sets" className="mt-6 inline-block font-medium text-lux underline underline-offset-4 hover:text-lux-dark">
        Go to parameter sets
      </Link>
    </main>
  );
}
