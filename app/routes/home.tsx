import { redirect } from "react-router";
import type { Route } from "./+types/home";
import { getUser } from "~/utils/auth.server";

export async function loader({ request }: Route.LoaderArgs) {
  throw redirect((await getUser(request)) ? "/dashboard" : "/login");
}
