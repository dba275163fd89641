import { redirect } from "next/navigation";
import type { ReactNode } from "react";
import { getSessionUser } from "@/lib/auth/access";
import { AppRail } from "@/components/shell/app-rail";

export default async function AppLayout({ children }: { children: ReactNode }) {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in");
  const { name, email } = user;

  return (
    <div className="min-h-screen md:flex">
      <a
        href="#main"
        className="sr-only rounded-md bg-lux px-3 py-2 text-white focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50"
      >
        Skip to content
      </a>
      <AppRail userName={name ?? email ?? "Signed in"} userEmail={email ?? ""} />
      <main id="main" tabIndex={-1} className="min-w-0 flex-1 px-4 py-6 outline-none sm:px-8 sm:py-8">
        {children}
      </main>
    </div>
  );
}
