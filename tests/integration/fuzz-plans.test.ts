import { vi } from "vitest";
import { FUZZ_GROUPS, fuzzRoutes } from "./fuzz-suite";

// The fuzz figure for the plans group of actions (tests/integration/fuzz-suite.ts says what it checks).
vi.mock("argon2", async (importOriginal) => (await import("./fast-argon2")).fastArgon2(await importOriginal()));

fuzzRoutes(FUZZ_GROUPS.plans);
