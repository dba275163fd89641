import { z } from "zod";

/** One caught message as the local SMTP stand-in stores it and the admin page and the tests read it. */
export const caughtMailSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
});
export type CaughtMail = z.infer<typeof caughtMailSchema>;
