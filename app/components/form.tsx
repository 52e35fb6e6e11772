import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from "react";

interface FieldProps extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  name: string;
  error?: string;
  hint?: ReactNode;
}

// A labelled input whose error message is tied to it for screen readers.
export function Field({ label, name, error, hint, id, className = "", ...input }: FieldProps) {
  const fieldId = id ?? `f-${name}`;
  const describedBy = [error ? `${fieldId}-error` : null, hint ? `${fieldId}-hint` : null].filter(Boolean).join(" ");
  return (
    <div className={className}>
      <label htmlFor={fieldId} className="block text-sm font-medium text-forge-800">
        {label}
      </label>
      <input
        id={fieldId}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy || undefined}
        className="mt-1 block w-full rounded border border-forge-300 bg-white px-3 py-2 text-base tabular aria-[invalid]:border-failed"
        {...input}
      />
      {hint ? (
        <p id={`${fieldId}-hint`} className="mt-1 text-xs text-forge-700">
          {hint}
        </p>
      ) : null}
      <FieldError id={fieldId} error={error} />
    </div>
  );
}

function FieldError({ id, error }: { id: string; error?: string }) {
  if (!error) return null;
  return (
    <p id={`${id}-error`} className="mt-1 text-sm font-medium text-failed">
      ✖ {error}
    </p>
  );
}

interface SelectFieldProps extends SelectHTMLAttributes<HTMLSelectElement> {
  label: string;
  name: string;
  error?: string;
  /** [value, text] pairs; or pass <option>s as children. */
  options?: [string, string][];
}

// A labelled select, tied to its error message like Field.
export function SelectField({ label, name, error, options, children, ...rest }: SelectFieldProps) {
  const id = `f-${name}`;
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium text-forge-800">
        {label}
      </label>
      <select
        id={id}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className="mt-1 block w-full rounded border border-forge-300 bg-white px-3 py-2 text-base aria-[invalid]:border-failed"
        {...rest}
      >
        {options?.map(([v, text]) => (
          <option key={v} value={v}>
            {text}
          </option>
        ))}
        {children}
      </select>
      <FieldError id={id} error={error} />
    </div>
  );
}

export function FormError({ message }: { message?: string | null }) {
  if (!message) return null;
  return (
    <p role="alert" className="rounded border border-failed bg-failed-50 px-3 py-2 text-sm font-medium text-failed">
      ✖ {message}
    </p>
  );
}

export function Button({ children, kind = "primary", ...rest }: React.ButtonHTMLAttributes<HTMLButtonElement> & { kind?: "primary" | "plain" }) {
  const look =
    kind === "primary"
      ? "bg-copper-700 text-white hover:bg-copper-600"
      : "border border-forge-300 bg-white text-forge-900 hover:bg-forge-100";
  return (
    <button className={`rounded px-4 py-2 font-medium ${look} disabled:opacity-60`} {...rest}>
      {children}
    </button>
  );
}

/** zod issues → first message per field name. */
export function fieldErrors(issues: { path: PropertyKey[]; message: string }[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join(".");
    out[key] ??= issue.message;
  }
  return out;
}
