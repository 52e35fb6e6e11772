import fs from "node:fs";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

// Uploads through the root middleware, as the server runs them: streamed, capped, sniffed, stored
// under server-made names, served only to the owning team. Each test file has its own upload dir.
const UPLOADS = vi.hoisted(() => {
  const dir = `${process.env.TMPDIR ?? "/tmp"}/sealwright-uploads-${process.pid}-${Math.random().toString(36).slice(2)}`;
  process.env.UPLOAD_DIR = dir;
  return dir;
});

import * as upload from "~/routes/engines/files-upload";
import * as fileRoute from "~/routes/app/file";
import * as filesPage from "~/routes/engines/files";
import { MAX_UPLOAD_BYTES } from "~/utils/upload-rules";
import { db } from "~/utils/db.server";
import { ORIGIN, signIn } from "./helpers";
import { through } from "./pipeline";

let builder = "";
let other = "";
let viewer = "";
let engineId = 0;
let assemblyId = 0;

beforeAll(async () => {
  builder = await signIn("builder@example.com");
  viewer = await signIn("viewer@example.com");
  other = await signIn("other-owner@example.com");
  const team = await db()("teams").where({ name: "Harrow Lane Boost Works" }).first("id");
  engineId = (await db()("engines").where({ team_id: team.id, cylinders: 6 }).first("id")).id;
  assemblyId = (await db()("assemblies").where({ team_id: team.id, engine_id: engineId }).first("id")).id;
});

afterAll(() => fs.rmSync(UPLOADS, { recursive: true, force: true }));

const storedFiles = (): string[] => {
  if (!fs.existsSync(UPLOADS)) return [];
  const out: string[] = [];
  const walk = (d: string) =>
    fs.readdirSync(d, { withFileTypes: true }).forEach((e) => (e.isDirectory() ? walk(path.join(d, e.name)) : out.push(e.name)));
  walk(UPLOADS);
  return out;
};
const fileRows = async () => Number((await db()("files").count({ n: "*" }).first())!.n);
const url = () => `/engines/${engineId}/files/upload`;

function formRequest(fd: FormData, cookie = builder) {
  return new Request(ORIGIN + url(), { method: "POST", headers: { Origin: ORIGIN, Cookie: cookie, Accept: "application/json" }, body: fd });
}

const BOUNDARY = "----sealwright-test-boundary";
const head = (name: string, type: string) =>
  new TextEncoder().encode(
    `--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename="${name}"\r\nContent-Type: ${type}\r\n\r\n`,
  );

/** A multipart body made chunk by chunk as it is read; counts what the server pulled. */
function streamed(chunks: () => Generator<Uint8Array>, opts: { failAfter?: number } = {}) {
  const pulled = { bytes: 0 };
  const it = chunks();
  const body = new ReadableStream<Uint8Array>({
    pull(c) {
      if (opts.failAfter !== undefined && pulled.bytes >= opts.failAfter) return c.error(new Error("connection reset by peer"));
      const next = it.next();
      if (next.done) return c.close();
      pulled.bytes += next.value.length;
      c.enqueue(next.value);
    },
  });
  const request = new Request(ORIGIN + url(), {
    method: "POST",
    headers: { Origin: ORIGIN, Cookie: builder, Accept: "application/json", "Content-Type": `multipart/form-data; boundary=${BOUNDARY}` },
    body,
    // @ts-expect-error Node's fetch needs duplex for a stream body
    duplex: "half",
  });
  return { request, pulled };
}

const params = () => ({ engineId: String(engineId) });

describe("uploads", () => {
  it("keeps a photo under a server-made name with a thumbnail, and serves it only to its team", async () => {
    const png = await sharp({ create: { width: 640, height: 480, channels: 3, background: "#a4521f" } })
      .png()
      .toBuffer();
    const fd = new FormData();
    fd.append("assemblyId", String(assemblyId));
    fd.append("file", new File([png], "../../head gasket.png", { type: "image/png" }));
    const out = await through(upload.action, formRequest(fd), params());
    expect(out.status).toBe(200);
    const file = (out.body as { file: { id: number; name: string; hasThumb: boolean; assemblyId: number } }).file;
    expect(file.name).toBe("head gasket.png");
    expect(file.hasThumb).toBe(true);
    expect(file.assemblyId).toBe(assemblyId);
    const row = await db()("files").where({ id: file.id }).first();
    expect(row.storage_key).toMatch(/^t\d+\/[0-9a-f-]{36}$/);
    expect(storedFiles().some((n) => n.includes("head"))).toBe(false);

    const served = await through(fileRoute.loader, new Request(`${ORIGIN}/files/${file.id}`, { headers: { Cookie: builder } }), {
      fileId: String(file.id),
    });
    expect(served.status).toBe(200);
    expect(served.headers.get("Content-Type")).toBe("image/png");
    expect(served.headers.get("X-Content-Type-Options")).toBe("nosniff");
    expect(served.headers.get("Content-Disposition")).toMatch(/^inline; filename\*=UTF-8''head%20gasket\.png$/);
    const thumb = await through(fileRoute.loader, new Request(`${ORIGIN}/files/${file.id}?thumb=1`, { headers: { Cookie: builder } }), {
      fileId: String(file.id),
    });
    expect(thumb.headers.get("Content-Type")).toBe("image/webp");
    expect(Number(thumb.headers.get("Content-Length"))).toBeLessThan(png.length);

    // another team's owner: not found, as if it did not exist
    expect(
      (
        await through(fileRoute.loader, new Request(`${ORIGIN}/files/${file.id}`, { headers: { Cookie: other } }), {
          fileId: String(file.id),
        })
      ).status,
    ).toBe(404);
    expect((await through(fileRoute.loader, new Request(`${ORIGIN}/files/${file.id}`), { fileId: String(file.id) })).status).toBe(302);
    // the demo viewer is a customer shown another engine: this engine's files are not theirs either
    const notShared = await through(fileRoute.loader, new Request(`${ORIGIN}/files/${file.id}`, { headers: { Cookie: viewer } }), {
      fileId: String(file.id),
    });
    expect(notShared.status).toBe(404);
    const page = await through(
      filesPage.loader,
      new Request(`${ORIGIN}/engines/${engineId}/files`, { headers: { Cookie: builder } }),
      params(),
    );
    expect((page.body as { files: { id: number }[] }).files.map((f) => f.id)).toContain(file.id);
  });

  it("refuses a renamed executable (by its content, not its name or type), writing nothing", async () => {
    const before = [await fileRows(), storedFiles().length];
    const elf = new Uint8Array(4096);
    elf.set([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01, 0x00]);
    const fd = new FormData();
    fd.append("file", new File([elf], "photo.jpg", { type: "image/jpeg" }));
    const out = await through(upload.action, formRequest(fd), params());
    expect(out.status).toBe(415);
    expect((out.body as { message: string }).message).toMatch(/Only photos \(JPEG, PNG, WebP\) and PDFs/);
    expect([await fileRows(), storedFiles().length]).toEqual(before);
  });

  it("refuses a file over the cap without reading it whole (no length given: the parser stops at 10 MB)", async () => {
    const before = [await fileRows(), storedFiles().length];
    const MB = new Uint8Array(1024 * 1024);
    const total = 40;
    const { request, pulled } = streamed(function* () {
      yield head("big.png", "image/png");
      for (let i = 0; i < total; i++) yield MB;
    });
    const out = await through(upload.action, request, params());
    expect(out.status).toBe(413);
    expect((out.body as { message: string }).message).toMatch(/at most 10\.0 MB/);
    expect(pulled.bytes).toBeLessThan(MAX_UPLOAD_BYTES + 3 * 1024 * 1024);
    expect(pulled.bytes).toBeLessThan(total * MB.length);
    expect([await fileRows(), storedFiles().length]).toEqual(before);
  });

  it("refuses a declared length over the cap before reading the body", async () => {
    const { request, pulled } = streamed(function* () {
      yield head("big.png", "image/png");
    });
    const declared = new Request(request, {
      headers: { ...Object.fromEntries(request.headers), "Content-Length": String(MAX_UPLOAD_BYTES * 3) },
    });
    const out = await through(upload.action, declared, params());
    expect(out.status).toBe(413);
    // only the part header the stream queues by itself when made; nothing read after it
    expect(pulled.bytes).toBeLessThan(1024);
  });

  it("an upload cut off mid-stream leaves no row and no file", async () => {
    const before = [await fileRows(), storedFiles().length];
    const png = await sharp({ create: { width: 1200, height: 900, channels: 3, background: "#2b4456" } })
      .png({ compressionLevel: 0 })
      .toBuffer();
    const { request } = streamed(
      function* () {
        yield head("cut.png", "image/png");
        for (let i = 0; i < png.length; i += 64 * 1024) yield png.subarray(i, i + 64 * 1024);
        yield new TextEncoder().encode(`\r\n--${BOUNDARY}--\r\n`);
      },
      { failAfter: Math.floor(png.length / 2) },
    );
    const out = await through(upload.action, request, params());
    expect(out.status).toBe(400);
    expect((out.body as { message: string }).message).toMatch(/cut off|could not be read/);
    expect([await fileRows(), storedFiles().length]).toEqual(before);
  });

  it("a viewer may not upload, and the team quota is stated on the files page", async () => {
    const fd = new FormData();
    fd.append("file", new File([new Uint8Array([1])], "x.png"));
    expect((await through(upload.action, formRequest(fd, viewer), params())).status).toBe(403);
    const page = await through(
      filesPage.loader,
      new Request(`${ORIGIN}/engines/${engineId}/files`, { headers: { Cookie: builder } }),
      params(),
    );
    expect((page.body as { quotaBytes: number }).quotaBytes).toBe(500 * 1024 * 1024);
  });
});
