import { useState, type ReactNode } from "react";
import { Form, NavLink, useLocation, useMatches } from "react-router";
import type { Role } from "~/lib/team/roles";
import { CAUTION_SHORT, pageShowsCaution } from "./caution";

export interface ShellProps {
  user: { name: string; email: string };
  team: { id: number; name: string };
  role: Role;
  memberships: { teamId: number; teamName: string; role: Role }[];
  nav: { to: string; label: string }[];
  children: ReactNode;
}

const ROLE_WORD: Record<Role, string> = { owner: "Owner", builder: "Builder", viewer: "Viewer" };

// Header (product, team switcher, person), navigation, page, footer caution.
export function AppShell({ user, team, role, memberships, nav, children }: ShellProps) {
  const [open, setOpen] = useState(false);
  const location = useLocation();
  return (
    <div className="flex min-h-screen flex-col">
      {/* the first Tab stop: past the header and its menu, straight to the page */}
      <a
        href="#main"
        className="no-print sr-only z-50 rounded bg-white px-4 py-2 font-bold text-forge-950 focus:not-sr-only focus:absolute focus:left-2 focus:top-2"
      >
        Skip to the page
      </a>
      {/* Escape closes the phone menu and hands focus back to its button */}
      <header
        className="no-print bg-forge-900 text-forge-50 on-dark"
        onKeyDown={(e) => {
          if (e.key !== "Escape" || !open) return;
          setOpen(false);
          document.getElementById("menu-button")?.focus();
        }}
      >
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
          <NavLink to="/dashboard" className="flex items-center gap-2 text-xl font-bold tracking-wide">
            <img src="/favicon.svg" alt="" className="h-7 w-7" />
            Sealwright
          </NavLink>
          <TeamSwitcher team={team} memberships={memberships} returnTo={location.pathname} />
          {/* Without JavaScript the menu button cannot open anything, so the navigation simply stays open. */}
          <noscript>
            <style>{"#main-nav{display:block!important}#menu-button{display:none!important}"}</style>
          </noscript>
          <button
            id="menu-button"
            type="button"
            className="ml-auto rounded border border-forge-500 px-3 py-1 md:hidden"
            aria-expanded={open}
            aria-controls="main-nav"
            onClick={() => setOpen((v) => !v)}
          >
            ☰ Menu
          </button>
          <div className="hidden items-center gap-3 text-sm md:ml-auto md:flex">
            <span>
              {user.name} · <span className="text-copper-200">{ROLE_WORD[role]}</span>
            </span>
            <Form method="post" action="/logout">
              <button type="submit" className="rounded border border-forge-500 px-3 py-1 hover:bg-forge-800">
                Sign out
              </button>
            </Form>
          </div>
        </div>
        <nav id="main-nav" aria-label="Main" className={`${open ? "block" : "hidden"} border-t border-forge-800 md:block`}>
          <ul className="mx-auto flex max-w-7xl flex-col px-2 md:flex-row md:gap-1">
            {nav.map((item) => (
              <li key={item.to}>
                <NavLink
                  to={item.to}
                  onClick={() => setOpen(false)}
                  className={({ isActive }) =>
                    `block px-3 py-2 text-base ${isActive ? "border-b-2 border-copper-500 font-bold text-white" : "text-forge-100 hover:text-white"}`
                  }
                >
                  {item.label}
                </NavLink>
              </li>
            ))}
            <li className="flex items-center justify-between border-t border-forge-800 px-3 py-2 text-sm md:hidden">
              <span>
                {user.name} · {ROLE_WORD[role]}
              </span>
              <Form method="post" action="/logout">
                <button type="submit" className="rounded border border-forge-500 px-3 py-1">
                  Sign out
                </button>
              </Form>
            </li>
          </ul>
        </nav>
      </header>
      <main id="main" tabIndex={-1} className="mx-auto w-full min-w-0 max-w-7xl flex-1 px-4 py-6 focus:outline-none">
        {children}
      </main>
      {/* the caution once per page: in full beside the figures where a page has them, else here */}
      {pageShowsCaution(useMatches()) ? null : (
        <footer className="border-t border-forge-100 bg-white px-4 py-3 text-center text-xs text-forge-700">
          ⚠ {CAUTION_SHORT} A failed seal or broken stud under boost can injure people.
        </footer>
      )}
    </div>
  );
}

function TeamSwitcher({
  team,
  memberships,
  returnTo,
}: {
  team: ShellProps["team"];
  memberships: ShellProps["memberships"];
  returnTo: string;
}) {
  if (memberships.length < 2) {
    return <span className="rounded bg-forge-800 px-2 py-1 text-sm">{team.name}</span>;
  }
  return (
    <Form method="post" action="/team/switch" className="flex items-center gap-2 text-sm">
      <label htmlFor="team-switch" className="sr-only">
        Shop
      </label>
      <select id="team-switch" name="teamId" defaultValue={team.id} className="rounded bg-forge-800 px-2 py-1 text-forge-50">
        {memberships.map((m) => (
          <option key={m.teamId} value={m.teamId}>
            {m.teamName} ({ROLE_WORD[m.role]})
          </option>
        ))}
      </select>
      <input type="hidden" name="returnTo" value={returnTo} />
      <button type="submit" className="rounded border border-forge-500 px-2 py-1 hover:bg-forge-800">
        Switch
      </button>
    </Form>
  );
}

export function PageTitle({ children, sub }: { children: ReactNode; sub?: ReactNode }) {
  return (
    <div className="mb-6">
      <h1 className="text-3xl font-bold">{children}</h1>
      {sub ? <p className="mt-1 text-forge-700">{sub}</p> : null}
    </div>
  );
}
