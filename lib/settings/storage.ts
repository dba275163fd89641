import { z } from "zod";
import { port } from "./port";

/*
 * The object-storage fragment (original measurement files). Every value has a working default
 * for the local S3 fake that scripts/s3.sh starts (s3rver, which accepts the key pair S3RVER /
 * S3RVER); a real S3-compatible service needs only these variables changed.
 */

export const storageEnvSchema = z
  .object({
    GYROLUX_S3_PORT: port.default(4568),
    GYROLUX_S3_ENDPOINT: z.url({ error: "GYROLUX_S3_ENDPOINT must be a URL such as http://127.0.0.1:4568" }).optional(),
    GYROLUX_S3_REGION: z.string().min(1).default("us-east-1"),
    GYROLUX_S3_BUCKET: z
      .string()
      .regex(
        /^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/,
        "GYROLUX_S3_BUCKET must be a valid S3 bucket name (3–63 lower-case letters, digits, dots, hyphens)",
      )
      .default("gyrolux-measurements"),
    GYROLUX_S3_ACCESS_KEY: z.string().min(1).default("S3RVER"),
    GYROLUX_S3_SECRET_KEY: z.string().min(1).default("S3RVER"),
  })
  .transform((env) => ({
    endpoint: env.GYROLUX_S3_ENDPOINT ?? `http://127.0.0.1:${env.GYROLUX_S3_PORT}`,
    region: env.GYROLUX_S3_REGION,
    bucket: env.GYROLUX_S3_BUCKET,
    accessKeyId: env.GYROLUX_S3_ACCESS_KEY,
    secretAccessKey: env.GYROLUX_S3_SECRET_KEY,
  }));

export type StorageSettings = z.output<typeof storageEnvSchema>;
