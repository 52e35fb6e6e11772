import { createContext, useContext } from "react";

// The per-response CSP nonce, handed from entry.server to the <Scripts> in root.
const NonceContext = createContext("");
export const NonceProvider = NonceContext.Provider;
export function useNonce(): string {
  return useContext(NonceContext);
}
