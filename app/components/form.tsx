import { useEffect, useRef, useState, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes } from "react";

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
        className="mt-1 block w-full rounded border border-forge-500 bg-white px-3 py-2 text-base tabular aria-[invalid]:border-failed"
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
        className="mt-1 block w-full rounded border border-forge-500 bg-white px-3 py-2 text-base aria-[invalid]:border-failed"
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

export function Button({
  children,
  kind = "primary",
  ...rest
}: React.ButtonHTMLAttributes<HTMLButtonElement> & { kind?: "primary" | "plain" }) {
  const look =
    kind === "primary"
      ? "bg-copper-700 text-white hover:bg-copper-600"
      : "border border-forge-500 bg-white text-forge-900 hover:bg-forge-100";
  return (
    <button className={`rounded px-4 py-2 font-medium ${look} disabled:opacity-60`} {...rest}>
      {children}
    </button>
  );
}

/** Conform's errors (field name → messages) → the first message of each field that has one. */
export function firstErrors(allErrors: Record<string, string[] | null | undefined>): Record<string, string> {
  return Object.fromEntries(Object.entries(allErrors).flatMap(([name, list]) => (list?.[0] ? [[name, list[0]]] : [])));
}

/**
 * The answer to a refused post: what went wrong and a link to each marked field. It takes focus
 * whenever a new answer arrives (`answer` changes), so a keyboard or screen-reader user lands on it
 * instead of the top of the page; role="alert" announces it to those who stay where they were.
 */
export function ErrorSummary({
  errors = {},
  message,
  answer,
  fieldId = (name) => `f-${name}`,
}: {
  /** Field name → its message (or Conform's list of messages, of which the first is shown). */
  errors?: Record<string, string | string[] | null | undefined>;
  message?: string | null;
  answer: unknown;
  fieldId?: (name: string) => string;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const entries = Object.entries(errors)
    .map(([name, text]) => [name, Array.isArray(text) ? text[0] : text] as const)
    .filter((e): e is readonly [string, string] => e[0] !== "form" && e[0] !== "" && Boolean(e[1]));
  const shown = Boolean(message) || entries.length > 0;
  // Field labels are read from the page once it runs, so each line names its field as the form does.
  const [labels, setLabels] = useState<Record<string, string>>({});
  useEffect(() => {
    if (!shown) return;
    ref.current?.focus();
    const found: Record<string, string> = {};
    for (const [name] of entries) {
      const text = document.querySelector(`label[for="${fieldId(name)}"]`)?.textContent?.trim();
      if (text) found[name] = text;
    }
    setLabels(found);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [answer, shown]);
  if (!shown) return null;
  const count = entries.length;
  return (
    <div
      ref={ref}
      tabIndex={-1}
      role="alert"
      data-testid="error-summary"
      className="mb-4 rounded border-2 border-failed bg-failed-50 px-4 py-3 text-failed"
    >
      <p id="error-summary-title" className="font-bold">
        ✖ {message ?? `Nothing was saved: ${count === 1 ? "one field needs" : `${count} fields need`} attention.`}
      </p>
      {count > 0 ? (
        <ul className="mt-1 list-disc pl-5 text-sm">
          {entries.map(([name, text]) => (
            <li key={name}>
              <a
                href={`#${fieldId(name)}`}
                className="underline"
                // with JavaScript, focus the field without a hash navigation (which would clear the answer)
                onClick={(e) => {
                  const field = document.getElementById(fieldId(name));
                  if (!field) return;
                  e.preventDefault();
                  field.focus();
                }}
              >
                {labels[name] ? `${labels[name]}: ` : ""}
                {text}
              </a>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

// A labelled text area, tied to its error message like Field.
export function TextArea({
  label,
  name,
  defaultValue,
  error,
  rows = 2,
  maxLength,
}: {
  label: string;
  name: string;
  defaultValue?: string;
  error?: string;
  rows?: number;
  maxLength?: number;
}) {
  const id = `f-${name}`;
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium text-forge-800">
        {label}
      </label>
      <textarea
        id={id}
        name={name}
        rows={rows}
        maxLength={maxLength}
        defaultValue={defaultValue}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className="mt-1 block w-full rounded border border-forge-500 bg-white px-3 py-2 text-base aria-[invalid]:border-failed"
      />
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-sm font-medium text-failed">
          ✖ {error}
        </p>
      ) : null}
    </div>
  );
}
