import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as upload from "~/routes/engines/files-upload";
import * as fileRoute from "~/routes/shop/file";
import * as filesPage from "~/routes/engines/files";
import * as itemUpload from "~/routes/libraries/item-files-upload";
import * as libraryEdit from "~/routes/libraries/edit";
import { receiveUpload, sweepOrphanFiles } from "~/models/files.server";
import { MAX_UPLOAD_BYTES } from "~/utils/upload-rules";
import { getEnv } from "~/utils/env.server";
import { fileStorage, newStorageKey } from "~/utils/files.server";
import { startFakeS3, type FakeS3 } from "../setup/fake-s3";
import { ORIGIN, signIn } from "./helpers";
import { through } from "./pipeline";
import { ownerDb } from "../setup/db-roles";

// Uploads through the root middleware, as the server runs them: streamed, capped, sniffed, stored
// under server-made names, served only to the owning team, taken away, and swept. The same tests run on
// each store: local disk (uploads.test.ts) and S3 against a local fake (uploads-s3.test.ts), each file
// with a store of its own. The settings are set before anything reads the environment (in beforeAll,
// before the first sign-in).
export function describeUploads(store: "disk" | "s3") {
  const diskDir = fs.mkdtempSync(path.join(os.tmpdir(), "sealwright-uploads-"));
  let fake: FakeS3 | null = null;
  let builder = "";
  let other = "";
  let viewer = "";
  let teamId = 0;
  let otherTeamId = 0;
  let engineId = 0;
  let assemblyId = 0;
  let fastenerId = 0;
  let builderId = 0;

  beforeAll(async () => {
    process.env.UPLOAD_DIR = diskDir;
    if (store === "s3") {
      fake = await startFakeS3();
      Object.assign(process.env, fake.env);
    }
    builder = await signIn("builder@example.com");
    viewer = await signIn("viewer@example.com");
    other = await signIn("other-owner@example.com");
    teamId = (await ownerDb()("teams").where({ name: "Harrow Lane Boost Works" }).first("id")).id;
    otherTeamId = (await ownerDb()("teams").where({ name: "Saltmarsh Dyno Cell" }).first("id")).id;
    engineId = (await ownerDb()("engines").where({ team_id: teamId, cylinders: 6 }).first("id")).id;
    assemblyId = (await ownerDb()("assemblies").where({ team_id: teamId, engine_id: engineId }).first("id")).id;
    fastenerId = (await ownerDb()("fasteners").where({ team_id: teamId }).first("id")).id;
    builderId = (await ownerDb()("users").where({ email: "builder@example.com" }).first("id")).id;
  });

  afterAll(async () => {
    fs.rmSync(diskDir, { recursive: true, force: true });
    await fake?.stop();
  });

  /** Every key in the store, page by page. */
  const storedKeys = async (): Promise<string[]> => {
    const keys: string[] = [];
    let cursor: string | undefined;
    do {
      const page = await fileStorage().list({ cursor, limit: 50 });
      keys.push(...page.files.map((f) => f.key));
      cursor = page.cursor;
    } while (cursor);
    return keys.sort();
  };
  const fileRows = async () => Number((await ownerDb()("files").count({ n: "*" }).first())!.n);
  const url = () => `/engines/${engineId}/files/upload`;
  const before = async () => [await fileRows(), (await storedKeys()).length];

  function formRequest(fd: FormData, cookie = builder, to = url()) {
    return new Request(ORIGIN + to, { method: "POST", headers: { Origin: ORIGIN, Cookie: cookie, Accept: "application/json" }, body: fd });
  }
  const fileGet = (id: number, cookie: string, query = "") =>
    through(fileRoute.loader, new Request(`${ORIGIN}/files/${id}${query}`, { headers: { Cookie: cookie } }), { fileId: String(id) });
  const fileDelete = (id: number, cookie: string, returnTo: string) =>
    through(
      fileRoute.action,
      new Request(`${ORIGIN}/files/${id}`, {
        method: "POST",
        headers: { Origin: ORIGIN, Cookie: cookie, "Content-Type": "application/x-www-form-urlencoded" },
        body: new URLSearchParams({ intent: "delete", returnTo }),
      }),
      { fileId: String(id) },
    );
  const PDF = new TextEncoder().encode("%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n");
  const pdfForm = (name: string) => {
    const fd = new FormData();
    fd.append("file", new File([PDF], name, { type: "application/pdf" }));
    return fd;
  };

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

  describe(`uploads (${store} store)`, () => {
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
      const row = await ownerDb()("files").where({ id: file.id }).first();
      expect(row.storage_key).toMatch(/^t\d+\/[0-9a-f-]{36}$/);
      const keys = await storedKeys();
      expect(keys).toContain(row.storage_key);
      expect(keys).toContain(`${row.storage_key}-thumb`);
      expect(keys.some((k) => k.includes("head"))).toBe(false);
      // the bytes are where the settings say, and nowhere else
      const onDisk = fs.readdirSync(diskDir).length > 0;
      expect(onDisk).toBe(store === "disk");
      if (fake) expect(fs.readdirSync(fake.dir, { recursive: true }).length).toBeGreaterThan(0);

      const served = await fileGet(file.id, builder);
      expect(served.status).toBe(200);
      expect(served.headers.get("Content-Type")).toBe("image/png");
      expect(served.headers.get("X-Content-Type-Options")).toBe("nosniff");
      expect(served.headers.get("Content-Disposition")).toMatch(/^inline; filename\*=UTF-8''head%20gasket\.png$/);
      const thumb = await fileGet(file.id, builder, "?thumb=1");
      expect(thumb.headers.get("Content-Type")).toBe("image/webp");
      expect(Number(thumb.headers.get("Content-Length"))).toBeLessThan(png.length);

      // another team's owner: not found, as if it did not exist
      expect((await fileGet(file.id, other)).status).toBe(404);
      expect((await through(fileRoute.loader, new Request(`${ORIGIN}/files/${file.id}`), { fileId: String(file.id) })).status).toBe(302);
      // the demo viewer is a customer shown another engine: this engine's files are not theirs either
      expect((await fileGet(file.id, viewer)).status).toBe(404);
      const page = await through(
        filesPage.loader,
        new Request(`${ORIGIN}/engines/${engineId}/files`, { headers: { Cookie: builder } }),
        params(),
      );
      expect((page.body as { files: { id: number }[] }).files.map((f) => f.id)).toContain(file.id);
    });

    it("refuses a renamed executable (by its content, not its name or type), writing nothing", async () => {
      const was = await before();
      const elf = new Uint8Array(4096);
      elf.set([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01, 0x00]);
      const fd = new FormData();
      fd.append("file", new File([elf], "photo.jpg", { type: "image/jpeg" }));
      const out = await through(upload.action, formRequest(fd), params());
      expect(out.status).toBe(415);
      expect((out.body as { message: string }).message).toMatch(/Only photos \(JPEG, PNG, WebP\) and PDFs/);
      expect(await before()).toEqual(was);
    });

    it("refuses a file over the cap without reading it whole (no length given: the parser stops at 10 MB)", async () => {
      const was = await before();
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
      expect(await before()).toEqual(was);
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
      const was = await before();
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
      expect(await before()).toEqual(was);
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

    it("refuses a file over the team's quota, read and written in one transaction, keeping nothing", async () => {
      const was = await before();
      const env = getEnv();
      const quota = env.UPLOAD_TEAM_QUOTA_MB;
      const used = Number((await ownerDb()("files").where({ team_id: teamId }).sum({ n: "size_bytes" }).first())!.n ?? 0);
      env.UPLOAD_TEAM_QUOTA_MB = (used + PDF.length - 1) / 1024 / 1024;
      try {
        const out = await through(upload.action, formRequest(pdfForm("one too many.pdf")), params());
        expect(out.status).toBe(413);
        expect((out.body as { message: string }).message).toMatch(/file space is full/);
      } finally {
        env.UPLOAD_TEAM_QUOTA_MB = quota;
      }
      expect(await before()).toEqual(was);
    });

    it("takes the stored objects away again when the row cannot be written", async () => {
      const was = await before();
      const request = formRequest(pdfForm("orphan.pdf"));
      // a fastener that does not exist: the row's foreign key refuses it after the bytes are stored
      await expect(receiveUpload(request, teamId, builderId, { fastenerId: 987_654 })).rejects.toThrow();
      expect(await before()).toEqual(was);
    });

    it("serves a PDF as a download, and a builder takes it away: row, objects and all, with an audit line", async () => {
      const out = await through(upload.action, formRequest(pdfForm("torque sheet.pdf")), params());
      expect(out.status).toBe(200);
      const id = (out.body as { file: { id: number } }).file.id;
      const row = await ownerDb()("files").where({ id }).first();
      const served = await fileGet(id, builder);
      expect(served.status).toBe(200);
      expect(served.headers.get("Content-Type")).toBe("application/pdf");
      expect(served.headers.get("Content-Disposition")).toBe("attachment; filename*=UTF-8''torque%20sheet.pdf");
      expect(served.headers.get("X-Content-Type-Options")).toBe("nosniff");
      expect(served.body).toBe(new TextDecoder().decode(PDF));

      const back = `/engines/${engineId}/files`;
      expect((await fileDelete(id, viewer, back)).status).toBe(403);
      expect((await fileDelete(id, other, back)).status).toBe(404);
      expect(await storedKeys()).toContain(row.storage_key);
      const gone = await fileDelete(id, builder, back);
      expect([gone.status, gone.location]).toEqual([302, back]);
      expect(await ownerDb()("files").where({ id }).first()).toBeUndefined();
      expect(await storedKeys()).not.toContain(row.storage_key);
      const audit = await ownerDb()("audit_events").where({ team_id: teamId, action: "file.deleted" }).orderBy("id", "desc").first();
      expect(JSON.parse(audit.detail)).toEqual({ fileId: id, name: "torque sheet.pdf" });
      expect((await fileGet(id, builder)).status).toBe(404);
    });

    it("keeps the maker's sheet on a fastener: builders upload, every member of the team reads, no one else", async () => {
      const itemParams = { kind: "fasteners", itemId: String(fastenerId) };
      const to = `/libraries/fasteners/${fastenerId}/files/upload`;
      const out = await through(itemUpload.action, formRequest(pdfForm("stud maker sheet.pdf"), builder, to), itemParams);
      expect(out.status).toBe(200);
      const file = (out.body as { file: { id: number; fastenerId: number; engineId: number | null } }).file;
      expect([file.fastenerId, file.engineId]).toEqual([fastenerId, null]);
      expect((await ownerDb()("files").where({ id: file.id }).first()).team_id).toBe(teamId);

      const page = (who: string) =>
        through(libraryEdit.loader, new Request(`${ORIGIN}/libraries/fasteners/${fastenerId}`, { headers: { Cookie: who } }), itemParams);
      expect(((await page(viewer)).body as { files: { id: number }[] }).files.map((f) => f.id)).toEqual([file.id]);
      expect(((await page(builder)).body as { files: { id: number }[] }).files.map((f) => f.id)).toEqual([file.id]);
      // a viewer of the shop reads the library and its sheets; another team finds neither
      expect((await fileGet(file.id, viewer)).status).toBe(200);
      expect((await fileGet(file.id, other)).status).toBe(404);
      expect((await page(other)).status).toBe(404);

      // a sheet of 300 KB: past the 128 KiB cap on form posts, so this passes only as an upload path of the guard
      const big = new Uint8Array(300 * 1024).fill(0x20);
      big.set(PDF);
      const bigForm = new FormData();
      bigForm.append("file", new File([big], "scanned sheet.pdf"));
      expect((await through(itemUpload.action, formRequest(bigForm, builder, to), itemParams)).status).toBe(200);

      const was = await before();
      expect((await through(itemUpload.action, formRequest(pdfForm("x.pdf"), viewer, to), itemParams)).status).toBe(403);
      expect((await through(itemUpload.action, formRequest(pdfForm("x.pdf"), other, to), itemParams)).status).toBe(404);
      const material = (await ownerDb()("materials").where({ team_id: teamId }).first("id")).id;
      const materialTo = `/libraries/materials/${material}/files/upload`;
      expect(
        (
          await through(itemUpload.action, formRequest(pdfForm("x.pdf"), builder, materialTo), {
            kind: "materials",
            itemId: String(material),
          })
        ).status,
      ).toBe(404);
      expect(await before()).toEqual(was);
      // the other team's own fastener page lists none of them
      const theirs = (await ownerDb()("fasteners").where({ team_id: otherTeamId }).first("id")).id;
      const theirPage = await through(
        libraryEdit.loader,
        new Request(`${ORIGIN}/libraries/fasteners/${theirs}`, { headers: { Cookie: other } }),
        { kind: "fasteners", itemId: String(theirs) },
      );
      expect((theirPage.body as { files: unknown[] }).files).toEqual([]);
    });

    it("the sweep removes an object no row names once it is old, and keeps rows' objects, young ones and foreign keys", async () => {
      const hoursAgo = (h: number) => Date.now() - h * 3_600_000;
      const put = (key: string, lastModified: number) =>
        fileStorage().set(key, new File([PDF], "sheet.pdf", { type: "application/pdf", lastModified }));
      const orphan = newStorageKey(teamId);
      const orphanThumb = `${newStorageKey(otherTeamId)}-thumb`;
      const young = newStorageKey(teamId);
      const kept = newStorageKey(otherTeamId);
      const foreign = "backups/readme.pdf";
      await put(orphan, hoursAgo(2));
      await put(orphanThumb, hoursAgo(3));
      await put(young, hoursAgo(0));
      await put(kept, hoursAgo(5));
      await put(foreign, hoursAgo(9));
      await ownerDb()("files").insert({
        team_id: otherTeamId,
        fastener_id: (await ownerDb()("fasteners").where({ team_id: otherTeamId }).first("id")).id,
        storage_key: kept,
        name: "sheet.pdf",
        content_type: "application/pdf",
        size_bytes: PDF.length,
        created_at: new Date().toISOString(),
      });
      const keysBefore = await storedKeys();
      // On disk in pages of two: the sweep lists the whole store before it removes anything. s3rver 3.7.1
      // orders a page by its on-disk names ("<key>-thumb._S3rver_object" before "<key>._S3rver_object"),
      // so across a page boundary it skips a key whose thumbnail ended the page; AWS orders by key. The
      // S3 pass takes one page (the default of 100), which real S3 would also page correctly.
      const swept = await sweepOrphanFiles({ olderThanMinutes: 60, pageSize: store === "disk" ? 2 : undefined });
      expect(swept.removed.sort()).toEqual([orphan, orphanThumb].sort());
      expect(swept.listed).toBe(keysBefore.length);
      expect(await storedKeys()).toEqual(keysBefore.filter((k) => k !== orphan && k !== orphanThumb));
      // every row's objects are still there
      for (const r of await ownerDb()("files").select("storage_key", "thumb_key"))
        for (const k of [r.storage_key, r.thumb_key].filter(Boolean)) expect(await storedKeys()).toContain(k);
      expect((await sweepOrphanFiles({ olderThanMinutes: 60 })).removed).toEqual([]);
    });
  });
}
