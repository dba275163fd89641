import type { SiteRole } from "../schema";

/** Who is making a request, as the queries need it (session or API token alike). */
export interface Caller {
  id: string;
  email: string;
  name: string;
  siteRole: SiteRole;
  via: "session" | "token";
}
