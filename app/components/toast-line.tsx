import { useRootData } from "~/root";

// The one-time message left by the last action (saved, renamed…).
export function ToastLine() {
  const toast = useRootData()?.toast;
  if (!toast) return null;
  const look = toast.kind === "done" ? "border-held bg-held-50 text-held" : "border-failed bg-failed-50 text-failed";
  return (
    <p role="status" className={`mb-4 rounded border px-4 py-2 font-medium ${look}`}>
      {toast.kind === "done" ? "✔" : "✖"} {toast.message}
    </p>
  );
}
