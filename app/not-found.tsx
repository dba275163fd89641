import { NotFoundContent } from "@/components/ui/not-found-content";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-6 py-24">
      <NotFoundContent />
    </main>
  );
}
