import { describe, expect, it } from "vitest";
import { isPostgres } from "~/utils/db.server";
import { rowsOf } from "../setup/engine";
import { ownerDb } from "../setup/db-roles";

// Migration 20261222000000_library-files on whichever engine this pass runs: SQLite rebuilds the files
// table for it (Knex's .alter()), so the rows, the foreign keys and the indexes of 20261217000000_records
// and 20261220000000_record-indexes must come through, down and up again; PostgreSQL alters in place.
const NAME = "20261222000000_library-files.ts";

/** The files table's indexes, foreign keys (column → table, on delete) and checks, on either engine. */
async function shape() {
  const knex = ownerDb();
  if (isPostgres(knex)) {
    const indexes = rowsOf<{ name: string }>(await knex.raw("select indexname as name from pg_indexes where tablename = 'files'"));
    const fks = rowsOf<{ def: string }>(
      await knex.raw("select pg_get_constraintdef(oid) as def from pg_constraint where conrelid = 'files'::regclass and contype = 'f'"),
    );
    const checks = rowsOf<{ name: string }>(
      await knex.raw("select conname as name from pg_constraint where conrelid = 'files'::regclass and contype = 'c'"),
    );
    const fk = (d: string) => {
      const m = /FOREIGN KEY \((\w+)\) REFERENCES (\w+)\(id\) ON DELETE (CASCADE|SET NULL)/.exec(d)!;
      return `${m[1]}→${m[2]} ${m[3]!.toLowerCase()}`;
    };
    return { indexes: indexes.map((i) => i.name).sort(), fks: fks.map((f) => fk(f.def)).sort(), checks: checks.map((c) => c.name) };
  }
  const indexes = rowsOf<{ name: string }>(
    await knex.raw("select name from sqlite_master where type = 'index' and tbl_name = 'files' and name not like 'sqlite_%'"),
  );
  const fks = rowsOf<{ from: string; table: string; on_delete: string }>(await knex.raw("pragma foreign_key_list(files)"));
  const table = rowsOf<{ sql: string }>(await knex.raw("select sql from sqlite_master where type = 'table' and name = 'files'"))[0]!.sql;
  return {
    indexes: [...indexes.map((i) => i.name), "files_pkey"].sort(),
    fks: fks.map((f) => `${f.from}→${f.table} ${f.on_delete.toLowerCase()}`).sort(),
    checks: [...table.matchAll(/constraint (\w+) check/gi)].map((m) => m[1]!),
  };
}

const RECORDS_INDEXES = [
  "files_assembly_id_index",
  "files_created_by_index",
  "files_engine_id_index",
  "files_pkey",
  "files_run_id_index",
  "files_storage_key_unique",
  "files_team_id_engine_id_index",
];
const RECORDS_FKS = [
  "assembly_id→assemblies set null",
  "created_by→users set null",
  "engine_id→engines cascade",
  "run_id→runs set null",
  "team_id→teams cascade",
];

describe("migration 20261222000000_library-files", () => {
  it("keeps the rows, foreign keys and indexes down and up, and lets a file belong to exactly one owner", async () => {
    const knex = ownerDb();
    const team = await knex("teams").where({ name: "Harrow Lane Boost Works" }).first("id");
    const engine = await knex("engines").where({ team_id: team.id }).first("id");
    const assembly = await knex("assemblies").where({ team_id: team.id }).first("id");
    const fastener = await knex("fasteners").where({ team_id: team.id }).first("id");
    const gasket = await knex("gaskets").where({ team_id: team.id }).first("id");
    const base = {
      team_id: team.id,
      name: "sheet.pdf",
      content_type: "application/pdf",
      size_bytes: 10,
      created_at: "2026-12-01T00:00:00.000Z",
    };
    await knex("files").insert({ ...base, engine_id: engine.id, assembly_id: assembly.id, storage_key: "t0/mig-engine" });
    await knex("files").insert({ ...base, fastener_id: fastener.id, storage_key: "t0/mig-fastener" });
    const engineRows = async () =>
      knex("files").whereNotNull("engine_id").orderBy("id").select("id", "engine_id", "assembly_id", "storage_key");

    const up = await shape();
    expect(up.indexes).toEqual([...RECORDS_INDEXES, "files_fastener_id_index", "files_gasket_id_index"].sort());
    expect(up.fks).toEqual([...RECORDS_FKS, "fastener_id→fasteners cascade", "gasket_id→gaskets cascade"].sort());
    expect(up.checks).toEqual(["files_one_owner"]);
    const kept = await engineRows();
    expect(kept.length).toBeGreaterThan(0);

    await knex.migrate.down({ name: NAME });
    expect(await shape()).toEqual({ indexes: RECORDS_INDEXES, fks: RECORDS_FKS, checks: [] });
    // the engine's files came through the rebuild; the library's went with their columns
    expect(await engineRows()).toEqual(kept);
    expect(await knex("files").where({ storage_key: "t0/mig-fastener" }).first()).toBeUndefined();
    await expect(knex("files").insert({ ...base, storage_key: "t0/mig-no-engine" })).rejects.toThrow();

    await knex.migrate.up({ name: NAME });
    expect(await shape()).toEqual(up);
    expect(await engineRows()).toEqual(kept);
    await knex("files").insert({ ...base, gasket_id: gasket.id, storage_key: "t0/mig-gasket" });
    for (const owners of [{}, { engine_id: engine.id, fastener_id: fastener.id }, { fastener_id: fastener.id, gasket_id: gasket.id }])
      await expect(knex("files").insert({ ...base, ...owners, storage_key: `t0/mig-${Object.keys(owners).join("-")}` })).rejects.toThrow();
    // a library file without a team is refused too: team_id stays NOT NULL (the row-security key)
    await expect(knex("files").insert({ ...base, team_id: null, gasket_id: gasket.id, storage_key: "t0/mig-no-team" })).rejects.toThrow();
  });
});
