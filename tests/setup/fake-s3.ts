import { spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import readline from "node:readline";

export interface FakeS3 {
  /** The settings that point the app's file storage at it (env.server.ts reads them). */
  env: Record<string, string>;
  /** Where s3rver keeps the bucket's objects on disk. */
  dir: string;
  stop: () => Promise<void>;
}

/** Starts s3rver in a child process (tests/setup/fake-s3-server.mjs) on a free port with a temp folder. */
export async function startFakeS3(bucket = "sealwright-test"): Promise<FakeS3> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "sealwright-s3-"));
  const child = spawn(process.execPath, ["--openssl-legacy-provider", path.resolve("tests/setup/fake-s3-server.mjs"), dir, bucket], {
    stdio: ["ignore", "pipe", "inherit"],
  });
  const port = await new Promise<number>((resolve, reject) => {
    child.once("exit", (code) => reject(new Error(`the fake S3 exited (${code}) before it listened`)));
    readline.createInterface({ input: child.stdout! }).once("line", (line) => resolve((JSON.parse(line) as { port: number }).port));
  });
  return {
    env: {
      FILE_STORAGE: "s3",
      S3_ENDPOINT: `http://127.0.0.1:${port}`,
      S3_BUCKET: bucket,
      S3_REGION: "us-east-1",
      // s3rver's own published test keys
      S3_ACCESS_KEY_ID: "S3RVER",
      S3_SECRET_ACCESS_KEY: "S3RVER",
    },
    dir,
    stop: async () => {
      const exited = new Promise((resolve) => child.once("exit", resolve));
      child.kill("SIGTERM");
      await exited;
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
