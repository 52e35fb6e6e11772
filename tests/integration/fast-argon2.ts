import crypto from "node:crypto";

// A fast stand-in for argon2 in the fuzz files: what they test is how each action reads its input,
// not the hash. The seeded accounts' real hashes all hold the demo password.
export function fastArgon2(real: { default: Record<string, unknown> }) {
  const fake = (p: string) => `fake$${crypto.createHash("sha256").update(p).digest("hex")}`;
  const verify = async (h: string, p: string) => (h.startsWith("$argon2") ? p === "sealwright-demo" : h === fake(p));
  return { default: { ...real.default, hash: async (p: string) => fake(p), verify } };
}
