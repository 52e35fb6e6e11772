import { isRouteErrorResponse, Link } from "react-router";

/** The page title a refused page carries (its route's meta gives it when the page answers an error). */
export const REFUSAL_TITLE = "Not open to your role · Sealwright";

// The kind answer to a 403 inside the engine page (its header and tabs stay): what was refused,
// who may do it, and the way back. Other errors go on to the engine page's own boundary.
export function RoleRefusal({ error, who, backTo, backLabel }: { error: unknown; who: string; backTo: string; backLabel: string }) {
  const forbidden = isRouteErrorResponse(error) && error.status === 403;
  if (!forbidden) throw error;
  return (
    <div className="rounded border border-forge-300 bg-white p-6">
      <h2 className="text-xl font-bold">Not open to your role</h2>
      <p className="mt-2 text-forge-700">
        {String(error.data)} {who}
      </p>
      <p className="mt-4">
        <Link to={backTo} className="text-copper-700 underline">
          {backLabel}
        </Link>
      </p>
    </div>
  );
}
