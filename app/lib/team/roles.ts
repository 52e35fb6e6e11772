// The three roles in a shop and their order: the one rank that the route guards, the navigation
// and the pages' buttons all read.

export const ROLES = ["viewer", "builder", "owner"] as const;
export type Role = (typeof ROLES)[number];

const RANK: Record<Role, number> = { viewer: 0, builder: 1, owner: 2 };

/** True when `role` may do what `needed` may. */
export function roleAtLeast(role: Role, needed: Role): boolean {
  return RANK[role] >= RANK[needed];
}

/** The lesser of two roles (a token acts at most at its own role and the person's role today). */
export function lowerRole(a: Role, b: Role): Role {
  return RANK[a] <= RANK[b] ? a : b;
}

/** The roles from the most to the least it may do, for lists that name the owner first. */
export const ROLES_HIGH_FIRST: readonly Role[] = [...ROLES].reverse();
