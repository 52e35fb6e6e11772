import { useEffect, useRef } from "react";

export interface ToastMessage {
  kind: "done" | "problem";
  message: string;
}

// The one-time message left by the last action (saved, renamed…). It takes focus when it arrives,
// so after a successful post a keyboard user is at its result, not back at the top of the page.
export function ToastLine({ toast }: { toast: ToastMessage | null | undefined }) {
  const ref = useRef<HTMLParagraphElement>(null);
  useEffect(() => {
    if (toast) ref.current?.focus();
  }, [toast]);
  if (!toast) return null;
  const look = toast.kind === "done" ? "border-held bg-held-50 text-held" : "border-failed bg-failed-50 text-failed";
  return (
    <p ref={ref} tabIndex={-1} role="status" className={`mb-4 rounded border px-4 py-2 font-medium ${look}`}>
      {toast.kind === "done" ? "✔" : "✖"} {toast.message}
    </p>
  );
}
