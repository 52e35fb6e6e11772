// Reads a JSON request body with a size cap, answering 400/413/415 in plain words.
export const MAX_JSON_BYTES = 64 * 1024;

export async function readJsonBody(request: Request, maxBytes = MAX_JSON_BYTES): Promise<unknown> {
  const type = request.headers.get("Content-Type") ?? "";
  if (!type.includes("application/json")) {
    throw Response.json({ error: "Send the body as JSON (Content-Type: application/json)." }, { status: 415 });
  }
  const declared = Number(request.headers.get("Content-Length") ?? 0);
  if (declared > maxBytes) throw tooLarge(maxBytes);
  const text = await readCapped(request, maxBytes);
  try {
    return JSON.parse(text);
  } catch {
    throw Response.json({ error: "The body is not valid JSON." }, { status: 400 });
  }
}

function tooLarge(maxBytes: number) {
  return Response.json({ error: `The body is larger than ${Math.round(maxBytes / 1024)} KiB.` }, { status: 413 });
}

async function readCapped(request: Request, maxBytes: number): Promise<string> {
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) {
      await reader.cancel();
      throw tooLarge(maxBytes);
    }
    chunks.push(value);
  }
  return new TextDecoder().decode(Buffer.concat(chunks));
}
