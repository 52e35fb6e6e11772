import type { RouteConfigEntry } from "@react-router/dev/routes";
import routes from "~/routes";
import type { Handler } from "./helpers";

// Every route of app/routes.ts, flattened: its id (as React Router names it), full path, file, and the
// loader and action its module exports. The matrix and fuzz tests are generated from this list, so a
// route added to routes.ts is tested (or fails for want of a row) without anyone remembering to.

export interface RouteInfo {
  id: string;
  path: string;
  file: string;
  loader?: Handler;
  action?: Handler;
}

const modules = import.meta.glob("/app/routes/**/*.{ts,tsx}");

function flatten(entries: RouteConfigEntry[], parent = ""): Omit<RouteInfo, "loader" | "action">[] {
  return entries.flatMap((e) => {
    const path = e.path ? `${parent.replace(/\/$/, "")}/${e.path}` : parent || "/";
    const id = e.id ?? e.file.replace(/\.[jt]sx?$/, "");
    return [{ id, path, file: e.file }, ...flatten(e.children ?? [], path)];
  });
}

export async function appRoutes(): Promise<RouteInfo[]> {
  return Promise.all(
    flatten(routes).map(async (r) => {
      const load = modules[`/app/${r.file}`];
      if (!load) throw new Error(`routes.ts names ${r.file}, which does not exist`);
      const mod = (await load()) as { loader?: Handler; action?: Handler };
      return { ...r, loader: mod.loader, action: mod.action };
    }),
  );
}

/** The path with its params filled in, and the params. */
export function fill(path: string, values: Record<string, string>): { url: string; params: Record<string, string> } {
  const params: Record<string, string> = {};
  const url = path.replace(/:(\w+)/g, (_, name: string) => {
    const v = values[name];
    if (v === undefined) throw new Error(`no value for :${name} in ${path}`);
    params[name] = v;
    return encodeURIComponent(v);
  });
  return { url, params };
}
