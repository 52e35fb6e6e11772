import { roleAtLeast, type Role } from "~/lib/team/roles";

// Which pages each role sees in the main navigation (the route guards enforce the same).
export const PAGE_ROLE: Record<string, Role> = {
  "/dashboard": "viewer",
  "/engines": "viewer",
  "/libraries": "viewer",
  "/evidence": "builder",
  "/team": "owner",
  "/settings": "viewer",
};

const LABELS: Record<string, string> = {
  "/dashboard": "Dashboard",
  "/engines": "Engines",
  "/libraries": "Libraries",
  "/evidence": "Evidence",
  "/team": "Team",
  "/settings": "Settings",
};

export function navFor(role: Role): { to: string; label: string }[] {
  return Object.entries(PAGE_ROLE)
    .filter(([, needed]) => roleAtLeast(role, needed))
    .map(([to]) => ({ to, label: LABELS[to] ?? to }));
}
