import { describe, expect, it } from "vitest";
import { parseEnv } from "~/utils/env.server";

// The object-storage settings are checked at start-up: a missing or malformed one stops the server with its name.
describe("file storage settings", () => {
  it("keeps uploads on disk unless FILE_STORAGE=s3", () => {
    const env = parseEnv({});
    expect([env.FILE_STORAGE, env.S3_REGION, env.FILE_SWEEP_MINUTES]).toEqual(["disk", "us-east-1", 60]);
  });

  it("names every setting S3 needs and lacks", () => {
    expect(() => parseEnv({ FILE_STORAGE: "s3", S3_ACCESS_KEY_ID: "key" })).toThrow(
      "Invalid environment:\n  S3_BUCKET: S3_BUCKET is needed when FILE_STORAGE=s3\n  S3_SECRET_ACCESS_KEY: S3_SECRET_ACCESS_KEY is needed when FILE_STORAGE=s3",
    );
  });

  it("refuses an unknown store, an endpoint that is not a URL and a non-boolean path style", () => {
    expect(() => parseEnv({ FILE_STORAGE: "ftp" })).toThrow("FILE_STORAGE: FILE_STORAGE must be disk or s3");
    const s3 = { FILE_STORAGE: "s3", S3_BUCKET: "b", S3_ACCESS_KEY_ID: "k", S3_SECRET_ACCESS_KEY: "s" };
    expect(() => parseEnv({ ...s3, S3_ENDPOINT: "localhost:9000" })).toThrow("S3_ENDPOINT: S3_ENDPOINT must be a full http(s) URL");
    expect(() => parseEnv({ ...s3, S3_FORCE_PATH_STYLE: "yes" })).toThrow("S3_FORCE_PATH_STYLE must be true or false");
    expect(() => parseEnv({ ...s3, FILE_SWEEP_MINUTES: "0" })).toThrow("FILE_SWEEP_MINUTES must be a positive number of minutes");
    expect(parseEnv({ ...s3, S3_ENDPOINT: "http://127.0.0.1:4569" }).S3_ENDPOINT).toBe("http://127.0.0.1:4569");
  });
});
