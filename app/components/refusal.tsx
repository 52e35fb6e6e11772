import { isRouteErrorResponse, Link } from "react-router";

// The kind answer to a 403 inside the engine page (its header and tabs stay): what was refused,
// who may do it, and the way back. Other errors go on to the engine page's own boundary.
export function RoleRefusal({ error, who, backTo, backLabel }: { error: unknown; who: string; backTo: string; backLabel: string }) {
  const forbidden = isRouteErrorResponse(error) && error.status === 403;
  if (!forbidden) throw error;
  return (
    <div className="rounded border border-forge-300 bg-white p-6">
      <title>Not open to your role · Sealwright</title>
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
