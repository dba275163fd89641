import { z } from "zod";

/** The demo seed's fragment (db/seed.ts). */
export const seedSettingsSchema = z
  .object({
    // The seeded site admin's password; unset → a random one printed once by the seed.
    GYROLUX_ADMIN_PASSWORD: z.string().min(12).optional(),
  })
  .transform((env) => ({ adminPassword: env.GYROLUX_ADMIN_PASSWORD }));

export type SeedSettings = z.output<typeof seedSettingsSchema>;
