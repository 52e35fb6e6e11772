import { createContext, type RouterContextProvider } from "react-router";

// The address a request came from, put into the router context by the production server
// (scripts/serve.mjs) from the socket, or from X-Forwarded-For when TRUST_PROXY=true. Never read from a
// header the client controls. Without that server (dev, tests) every request shares "unknown".
export const clientAddressContext = createContext<string>("unknown");

export function clientAddress(context: unknown): string {
  try {
    return (context as RouterContextProvider | undefined)?.get(clientAddressContext) ?? "unknown";
  } catch {
    return "unknown";
  }
}
