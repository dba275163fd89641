import Link from "next/link";

/** What a missing page or item says: the same words for an unknown address and an item of a lab the user is not in. */
export function NotFoundContent({ headingLevel = 1 }: { headingLevel?: 1 | 2 }) {
  const Heading = headingLevel === 1 ? "h1" : "h2";
  return (
    <div>
      <p className="text-sm font-medium tracking-wide text-lux-dark uppercase">Not found</p>
      <Heading className="mt-2 text-2xl font-semibold">There is nothing at this address</Heading>
      <p className="mt-3 text-ink-soft">The page may have moved, or the item was deleted or belongs to a lab you are not a member of.</p>
      <Link href="/parameter-sets" className="mt-6 inline-block font-medium text-lux-dark underline underline-offset-4 hover:text-ink">
        Go to parameter sets
      </Link>
    </div>
  );
}
