import type { ReactNode } from "react";
import { CAUTION_SHORT } from "./caution";
import { ToastLine, type ToastMessage } from "./toast-line";

// The plain frame around sign-in and sign-up: product name, one card, the caution line.
export function AuthFrame({ title, toast, children }: { title: string; toast?: ToastMessage | null; children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col bg-forge-900">
      <main className="flex flex-1 items-center justify-center p-4">
        <div className="w-full max-w-md rounded-lg bg-white p-6 shadow-xl sm:p-8">
          <p className="flex items-center gap-2 text-2xl font-bold tracking-wide text-forge-900">
            <img src="/favicon.svg" alt="" className="h-8 w-8" /> Sealwright
          </p>
          <p className="mt-1 text-sm text-forge-700">Head-seal planning and build records for engine shops</p>
          <h1 className="mt-6 text-xl font-bold">{title}</h1>
          <div className="mt-4">
            {/* e.g. "Password changed" after a reset lands here */}
            <ToastLine toast={toast} />
            {children}
          </div>
        </div>
      </main>
      <footer className="px-4 pb-4 text-center text-xs text-forge-100">{CAUTION_SHORT}</footer>
    </div>
  );
}
