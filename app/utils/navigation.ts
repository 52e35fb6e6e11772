import type { Role } from "~/models/user.server";

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

const RANK: Record<Role, number> = { viewer: 0, builder: 1, owner: 2 };

export function navFor(role: Role): { to: string; label: string }[] {
  return Object.entries(PAGE_ROLE)
    .filter(([, needed]) => RANK[role] >= RANK[needed])
    .map(([to]) => ({ to, label: LABELS[to] ?? to }));
}
