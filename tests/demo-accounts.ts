import { DEMO_USERS } from "@/db/demo-data";

/*
 * The seeded demo accounts (db/demo-data.ts) by the part each plays, for the integration and the
 * browser tests: the demo lab's owner, editor and viewer, the owner of the other lab, the site admin.
 */
export const DEMO = {
  owner: DEMO_USERS.lead.email,
  editor: DEMO_USERS.postdoc.email,
  viewer: DEMO_USERS.student.email,
  outsider: DEMO_USERS.outsider.email,
  admin: DEMO_USERS.admin.email,
} as const;

export type DemoAccount = keyof typeof DEMO;
