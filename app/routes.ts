import { type RouteConfig, index, layout, route } from "@react-router/dev/routes";

// Every URL of the app, in one list.
export default [
  index("routes/home.tsx"),
  route("login", "routes/auth/login.tsx"),
  route("signup", "routes/auth/signup.tsx"),
  route("logout", "routes/auth/logout.tsx"),
  route("team/switch", "routes/app/team-switch.tsx"),
  layout("routes/app/layout.tsx", [
    route("dashboard", "routes/app/dashboard.tsx"),
    route("engines", "routes/app/engines.tsx"),
    route("libraries", "routes/app/libraries.tsx"),
    route("evidence", "routes/app/evidence.tsx"),
    route("team", "routes/app/team.tsx"),
    route("settings", "routes/app/settings.tsx"),
  ]),
  route("healthz", "routes/api/healthz.ts"),
] satisfies RouteConfig;
