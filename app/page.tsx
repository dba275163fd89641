import { redirect } from "next/navigation";
import { auth } from "@/lib/auth/config";

export default async function HomePage() {
  const session = await auth();
  redirect(session?.user ? "/parameter-sets" : "/sign-in");
}
