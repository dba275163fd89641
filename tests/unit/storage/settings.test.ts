import { describe, expect, it } from "vitest";
import { storageEnvSchema } from "@/lib/settings/storage";

describe("object-storage settings", () => {
  it("defaults to the local S3 fake", () => {
    expect(storageEnvSchema.parse({})).toEqual({
      endpoint: "http://127.0.0.1:4568",
      region: "us-east-1",
      bucket: "gyrolux-measurements",
      accessKeyId: "S3RVER",
      secretAccessKey: "S3RVER",
    });
  });

  it("builds the endpoint from the port and lets an explicit endpoint win", () => {
    expect(storageEnvSchema.parse({ GYROLUX_S3_PORT: "9344" }).endpoint).toBe("http://127.0.0.1:9344");
    expect(storageEnvSchema.parse({ GYROLUX_S3_PORT: "9344", GYROLUX_S3_ENDPOINT: "https://s3.example.test" }).endpoint).toBe(
      "https://s3.example.test",
    );
  });

  it("fails loudly on a bad port or bucket name", () => {
    expect(() => storageEnvSchema.parse({ GYROLUX_S3_PORT: "seventy" })).toThrow();
    expect(() => storageEnvSchema.parse({ GYROLUX_S3_BUCKET: "Bad_Bucket" })).toThrow(/valid S3 bucket name/);
  });
});
