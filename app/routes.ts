import { type RouteConfig, index, layout, route } from "@react-router/dev/routes";

// Every URL of the app, in one list.
export default [
  index("routes/home.tsx"),
  route("login", "routes/auth/login.tsx"),
  route("signup", "routes/auth/signup.tsx"),
  route("logout", "routes/auth/logout.tsx"),
  route("team/switch", "routes/app/team-switch.tsx"),
  route("team/export", "routes/app/team-export.ts"),
  layout("routes/app/layout.tsx", [
    route("dashboard", "routes/app/dashboard.tsx"),
    route("engines", "routes/engines/list.tsx"),
    route("engines/new", "routes/engines/new.tsx"),
    route("engines/:engineId/duplicate", "routes/engines/duplicate.tsx"),
    route("engines/:engineId", "routes/engines/engine.tsx", [
      index("routes/engines/overview.tsx"),
      route("edit", "routes/engines/edit.tsx"),
      route("plans", "routes/plans/list.tsx"),
      route("plans/new", "routes/plans/new.tsx"),
      route("plans/:planId", "routes/plans/editor.tsx"),
      route("plans/:planId/copy", "routes/plans/copy.tsx"),
      route("compare", "routes/plans/compare.tsx"),
      route("chamber", "routes/engines/chamber.tsx"),
      route("assembly", "routes/engines/later.tsx", { id: "engine-assembly" }),
      route("runs", "routes/engines/later.tsx", { id: "engine-runs" }),
      route("files", "routes/engines/later.tsx", { id: "engine-files" }),
    ]),
    route("libraries", "routes/libraries/layout.tsx", [
      index("routes/libraries/index.tsx"),
      route(":kind", "routes/libraries/list.tsx"),
      route(":kind/new", "routes/libraries/edit.tsx", { id: "library-new" }),
      route(":kind/:itemId", "routes/libraries/edit.tsx", { id: "library-edit" }),
    ]),
    route("evidence", "routes/app/evidence.tsx"),
    route("team", "routes/app/team.tsx"),
    route("settings", "routes/app/settings.tsx"),
  ]),
  route("api/v1/estimate", "routes/api/estimate.ts"),
  route("healthz", "routes/api/healthz.ts"),
] satisfies RouteConfig;
