import { signOutAction } from "@/lib/auth/actions";

export function SignOutButton() {
  return (
    <form action={signOutAction}>
      <button type="submit" className="rounded-md px-2 py-1 text-sm font-medium text-lux-dark underline-offset-4 hover:underline">
        Sign out
      </button>
    </form>
  );
}
