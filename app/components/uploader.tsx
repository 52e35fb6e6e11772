import { useRef, useState } from "react";
import { useRevalidator } from "react-router";
import { UPLOAD_RULE_TEXT } from "~/utils/upload-rules";

// One file to an upload endpoint: the engine's (given engineId), or another (given action, e.g. a
// library item's). With JavaScript it goes by XMLHttpRequest, whose upload events drive a progress bar,
// and the page reloads its data when the file is kept; without, the form posts.
export function Uploader({
  engineId,
  action = `/engines/${engineId}/files/upload`,
  assemblyId,
  runId,
  returnTo,
  label = "Add a photo or PDF",
}: ({ engineId: number; action?: undefined } | { engineId?: undefined; action: string }) & {
  assemblyId?: number;
  runId?: number;
  returnTo: string;
  label?: string;
}) {
  const [progress, setProgress] = useState<number | null>(null);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const revalidator = useRevalidator();
  const formRef = useRef<HTMLFormElement>(null);
  const id = `upload-${assemblyId ?? "a"}-${runId ?? "r"}`;

  function send(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const body = new FormData(form);
    const file = body.get("file");
    if (!(file instanceof File) || file.size === 0) return setMessage({ ok: false, text: "Choose a file first." });
    const xhr = new XMLHttpRequest();
    xhr.open("POST", action);
    xhr.setRequestHeader("Accept", "application/json");
    xhr.upload.onprogress = (ev) => ev.lengthComputable && setProgress(ev.loaded / ev.total);
    xhr.onload = () => {
      let answer: { ok?: boolean; message?: string } = {};
      try {
        answer = JSON.parse(xhr.responseText);
      } catch {
        /* a refusal from the request guard may be plain text */
      }
      if (xhr.status === 200 && answer.ok) {
        setMessage({ ok: true, text: `Kept ${file.name}.` });
        form.reset();
        revalidator.revalidate();
      } else
        setMessage({
          ok: false,
          text:
            answer.message ??
            (xhr.status === 413 ? "Files may be at most 10 MB each; this one was refused." : `The upload was refused (${xhr.status}).`),
        });
      setProgress(null);
    };
    xhr.onerror = () => {
      setMessage({ ok: false, text: "The upload was cut off; nothing was kept. Try again." });
      setProgress(null);
    };
    setMessage(null);
    setProgress(0);
    xhr.send(body);
  }

  return (
    <form
      ref={formRef}
      method="post"
      action={action}
      encType="multipart/form-data"
      onSubmit={send}
      className="no-print mt-2 rounded border border-dashed border-forge-300 p-3"
    >
      <input type="hidden" name="returnTo" value={returnTo} />
      {assemblyId ? <input type="hidden" name="assemblyId" value={assemblyId} /> : null}
      {runId ? <input type="hidden" name="runId" value={runId} /> : null}
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <div className="mt-1 flex flex-wrap items-center gap-2">
        <input
          id={id}
          name="file"
          type="file"
          accept="image/jpeg,image/png,image/webp,application/pdf"
          aria-describedby={`${id}-rule`}
          className="max-w-full text-sm"
        />
        <button type="submit" className="rounded bg-copper-700 px-3 py-1 text-sm font-medium text-white" disabled={progress !== null}>
          Upload
        </button>
      </div>
      <p id={`${id}-rule`} className="mt-1 text-xs text-forge-700">
        {UPLOAD_RULE_TEXT}
      </p>
      {progress !== null ? (
        <div className="mt-2">
          <progress max={1} value={progress} aria-label="Upload progress" className="w-full" />
          <span className="text-xs tabular">{Math.round(progress * 100)} %</span>
        </div>
      ) : null}
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={`mt-1 text-sm font-medium ${message.ok ? "text-held" : "text-failed"}`}>
          {message.ok ? "✔" : "✖"} {message.text}
        </p>
      ) : null}
    </form>
  );
}

/** The files as thumbnails or document links; with `returnTo`, each has a button that takes it away (builders). */
export function FileList({
  files,
  returnTo,
}: {
  files: { id: number; name: string; contentType: string; sizeBytes: number; hasThumb: boolean }[];
  returnTo?: string;
}) {
  if (files.length === 0) return null;
  return (
    <ul className="mt-2 flex flex-wrap gap-3">
      {files.map((f) => (
        <li key={f.id} className="w-40 text-xs">
          {f.hasThumb ? (
            <a href={`/files/${f.id}`} target="_blank" rel="noreferrer">
              <img
                src={`/files/${f.id}?thumb=1`}
                alt={`Photo: ${f.name}`}
                className="h-28 w-40 rounded border border-forge-300 object-cover"
              />
            </a>
          ) : (
            <a href={`/files/${f.id}`} download className="block rounded border border-forge-300 p-3 text-copper-700 underline">
              📄 {f.name}
            </a>
          )}
          <span className="block truncate" title={f.name}>
            {f.name} · {(f.sizeBytes / 1024).toFixed(0)} KB
          </span>
          {returnTo ? (
            <form method="post" action={`/files/${f.id}`} className="no-print">
              <input type="hidden" name="returnTo" value={returnTo} />
              <button type="submit" name="intent" value="delete" className="text-failed underline" aria-label={`Take away ${f.name}`}>
                Take away
              </button>
            </form>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
