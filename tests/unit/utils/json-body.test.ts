// The JSON body reader: the declared size is refused before a byte is read, the stream is capped too.
import { describe, expect, it } from "vitest";
import { MAX_JSON_BYTES, readJsonBody } from "../../../app/utils/json-body.server";

const post = (body: BodyInit, headers: Record<string, string>) =>
  new Request("http://localhost/api/v1/estimate", { method: "POST", body, headers });
async function status(p: Promise<unknown>): Promise<number> {
  try {
    await p;
    return 200;
  } catch (r) {
    return (r as Response).status;
  }
}

describe("readJsonBody", () => {
  it("caps at 64 KiB", () => {
    expect(MAX_JSON_BYTES).toBe(65_536);
  });
  it("a declared Content-Length over the cap is 413 even when the body sent is small", async () => {
    expect(
      await status(readJsonBody(post("{}", { "Content-Type": "application/json", "Content-Length": String(MAX_JSON_BYTES + 1) }))),
    ).toBe(413);
  });
  it("a declared length at the cap is read", async () => {
    expect(await readJsonBody(post('{"a":1}', { "Content-Type": "application/json", "Content-Length": String(MAX_JSON_BYTES) }))).toEqual({
      a: 1,
    });
  });
  it("a body over the cap without a declared length is 413 too", async () => {
    expect(await status(readJsonBody(post(`"${"x".repeat(MAX_JSON_BYTES)}"`, { "Content-Type": "application/json" })))).toBe(413);
  });
  it("not JSON: 415 for the type, 400 for the text", async () => {
    expect(await status(readJsonBody(post("{}", { "Content-Type": "text/plain" })))).toBe(415);
    expect(await status(readJsonBody(post("{nope", { "Content-Type": "application/json" })))).toBe(400);
  });
});
