import type { ReactNode } from "react";
import { Wordmark } from "@/components/brand/wordmark";

export default function PublicLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-ink/10 px-6 py-4">
        <Wordmark className="text-lg" />
      </header>
      <main id="main" className="flex flex-1 items-start justify-center px-4 py-12 sm:py-20">
        <div className="w-full max-w-md">{children}</div>
      </main>
      <footer className="px-6 py-4 text-xs text-ink-soft">
        Faraday rotation in paramagnets, split into electric-dipole and magnetic-dipole parts.
      </footer>
    </div>
  );
}
