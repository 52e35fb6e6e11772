import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";

// The development and test mail sink's store: one JSON file per message caught, in a folder, so the
// dev-only mailbox page and the browser tests (other processes than the sink) can read what it caught.

export interface StoredMessage {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
}

export function writeStoredMessage(dir: string, message: Omit<StoredMessage, "id" | "receivedAt">): StoredMessage {
  fs.mkdirSync(dir, { recursive: true });
  const receivedAt = new Date().toISOString();
  // time first, so the names sort in the order the messages came
  const id = `${receivedAt.replace(/[-:.TZ]/g, "")}-${crypto.randomBytes(4).toString("hex")}`;
  const stored = { id, receivedAt, ...message };
  const file = path.join(dir, `${id}.json`);
  // written whole and then renamed, so a reader never sees half a message
  fs.writeFileSync(`${file}.part`, JSON.stringify(stored));
  fs.renameSync(`${file}.part`, file);
  return stored;
}

/** Every message in the store, newest first. */
export function listStoredMessages(dir: string): StoredMessage[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir)
    .filter((f) => f.endsWith(".json"))
    .sort()
    .reverse()
    .map((f) => JSON.parse(fs.readFileSync(path.join(dir, f), "utf8")) as StoredMessage);
}

export function getStoredMessage(dir: string, id: string): StoredMessage | null {
  if (!/^[0-9]+-[0-9a-f]{8}$/.test(id)) return null;
  const file = path.join(dir, `${id}.json`);
  return fs.existsSync(file) ? (JSON.parse(fs.readFileSync(file, "utf8")) as StoredMessage) : null;
}
