import Link from "next/link";
import { Wordmark } from "@/components/brand/wordmark";
import { NavLinks } from "./nav-links";
import { RailMenu } from "./rail-menu";
import { SignOutButton } from "./sign-out-button";

/** The signed-in frame: a left rail on wide screens, a bar with a menu button on narrow ones. */
export function AppRail({ userName, userEmail }: { userName: string; userEmail: string }) {
  return (
    <aside
      className={
        "border-b border-ink/10 bg-paper-sunk/60 " +
        "md:sticky md:top-0 md:flex md:h-screen md:w-60 md:overflow-y-auto md:shrink-0 md:flex-col md:border-r md:border-b-0"
      }
    >
      <RailMenu
        brand={
          <Link href="/parameter-sets" className="rounded-md">
            <Wordmark className="text-lg" />
          </Link>
        }
      >
        <nav aria-label="Main" className="px-2 pb-2 md:flex-1">
          <NavLinks />
        </nav>
        <div className="flex items-center justify-between gap-2 border-t border-ink/10 px-4 py-3 md:block">
          <p className="min-w-0 text-sm">
            <span className="block truncate font-medium" title={userEmail}>
              {userName}
            </span>
            <span className="block truncate text-xs text-ink-soft">{userEmail}</span>
          </p>
          <div className="md:mt-2 md:-ml-2">
            <SignOutButton />
          </div>
        </div>
      </RailMenu>
    </aside>
  );
}
