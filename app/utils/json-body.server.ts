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

/**
 * The chunks of a body up to maxBytes, or null as soon as it passes them. Reading stops there; the
 * cancel is not awaited (on a cloned body a tee's cancel settles only once both branches are cancelled).
 */
export async function readUpTo(body: ReadableStream<Uint8Array>, maxBytes: number): Promise<Uint8Array[] | null> {
  const reader = body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) return chunks;
    size += value.byteLength;
    if (size > maxBytes) {
      reader.cancel().catch(() => {});
      return null;
    }
    chunks.push(value);
  }
}

async function readCapped(request: Request, maxBytes: number): Promise<string> {
  if (!request.body) return "";
  const chunks = await readUpTo(request.body, maxBytes);
  if (chunks === null) throw tooLarge(maxBytes);
  return new TextDecoder().decode(Buffer.concat(chunks));
}
