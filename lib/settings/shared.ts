import { databaseSettingsSchema } from "./database";
import { mailSettingsSchema } from "./mail";
import { runSettingsSchema } from "./runs";
import { storageEnvSchema } from "./storage";

/** The fragments both variants read: the web server and the command-line programs share these. */
export const sharedFragments = {
  database: databaseSettingsSchema,
  storage: storageEnvSchema,
  mail: mailSettingsSchema,
  runs: runSettingsSchema,
};
