import { useCallback, useEffect, useState } from "react";
import { useDropzone, type FileRejection } from "react-dropzone";
import { useNavigate } from "react-router";

const LIMIT = 20 * 1024 * 1024;
type Item = { name: string; progress: number; status: "uploading" | "done" | "failed"; message?: string; location?: string };

/**
 * Vendor CSV upload. Without JavaScript: a plain multipart form with a file input. With it:
 * a drop zone (react-dropzone) taking several files, each sent with its own progress bar.
 */
export function UploadDrop({ action }: { action: string }) {
  const [hydrated, setHydrated] = useState(false);
  const [items, setItems] = useState<Item[]>([]);
  const navigate = useNavigate();
  useEffect(() => setHydrated(true), []);

  const send = useCallback(
    (file: File, index: number) =>
      new Promise<string | null>((resolve) => {
        const xhr = new XMLHttpRequest();
        const body = new FormData();
        body.append("file", file);
        xhr.open("POST", action);
        xhr.setRequestHeader("Accept", "application/json");
        xhr.upload.onprogress = (e) => {
          if (e.lengthComputable) setItems((xs) => xs.map((x, i) => (i === index ? { ...x, progress: e.loaded / e.total } : x)));
        };
        xhr.onload = () => {
          let payload: { location?: string; error?: string } = {};
          try {
            payload = JSON.parse(xhr.responseText);
          } catch {}
          const ok = xhr.status < 300 && payload.location;
          setItems((xs) =>
            xs.map((x, i) =>
              i === index
                ? { ...x, progress: 1, status: ok ? "done" : "failed", message: ok ? undefined : payload.error ?? `Upload failed (${xhr.status}).`, location: payload.location }
                : x,
            ),
          );
          resolve(ok ? payload.location! : null);
        };
        xhr.onerror = () => {
          setItems((xs) => xs.map((x, i) => (i === index ? { ...x, status: "failed", message: "The connection failed." } : x)));
          resolve(null);
        };
        xhr.send(body);
      }),
    [action],
  );

  const onDrop = useCallback(
    async (accepted: File[], rejected: FileRejection[]) => {
      const start = items.length;
      const next: Item[] = [
        ...accepted.map((f) => ({ name: f.name, progress: 0, status: "uploading" as const })),
        ...rejected.map((r) => ({
          name: r.file.name,
          progress: 0,
          status: "failed" as const,
          message: r.errors.map((e) => (e.code === "file-too-large" ? `Larger than ${LIMIT / 1048576} MB.` : e.code === "file-invalid-type" ? "Not a CSV file." : e.message)).join(" "),
        })),
      ];
      setItems((xs) => [...xs, ...next]);
      const locations = await Promise.all(accepted.map((f, i) => send(f, start + i)));
      const ok = locations.filter((l): l is string => Boolean(l));
      if (accepted.length === 1 && ok.length === 1) navigate(ok[0]);
      else if (ok.length > 0) navigate(".", { replace: true });
    },
    [items.length, navigate, send],
  );

  const { getRootProps, getInputProps, isDragActive } = useDropzone({
    onDrop,
    maxSize: LIMIT,
    multiple: true,
    accept: { "text/csv": [".csv"], "text/plain": [".txt", ".tsv"], "text/tab-separated-values": [".tsv"] },
  });

  if (!hydrated) {
    return (
      <form method="post" action={action} encType="multipart/form-data" className="flex flex-wrap items-end gap-3">
        <div>
          <label className="label" htmlFor="upload-file">
            CSV file
          </label>
          <input id="upload-file" name="file" type="file" accept=".csv,.tsv,.txt,text/csv" className="text-sm" required />
        </div>
        <button className="btn">Upload</button>
      </form>
    );
  }
  return (
    <div className="space-y-2">
      <div
        {...getRootProps({
          className: `flex min-h-28 cursor-pointer flex-col items-center justify-center rounded-lg border-2 border-dashed px-4 py-6 text-center text-sm ${
            isDragActive ? "border-brand-500 bg-brand-50" : "border-slate-300 bg-slate-50"
          }`,
        })}
      >
        <input {...getInputProps({ "aria-label": "CSV files" })} data-testid="upload-input" />
        <p className="font-semibold text-slate-800">Drop vendor CSV files here, or click to choose</p>
        <p className="text-xs text-slate-500">.csv, .tsv or .txt · up to 20 MB each · several at once</p>
      </div>
      {items.length ? (
        <ul className="space-y-1 text-sm" aria-live="polite">
          {items.map((it, i) => (
            <li key={i} className="flex items-center gap-2">
              <span className="w-56 truncate">{it.name}</span>
              <UploadBar item={it} />
              {it.status === "done" && it.location ? <a href={it.location}>map and check</a> : null}
              {it.status === "failed" ? (
                <span className="text-fail" role="alert">
                  Refused: {it.message}
                </span>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

/** The bar of one upload: brand colour while sending and when stored, red (full width) when refused. */
function UploadBar({ item }: { item: Item }) {
  const failed = item.status === "failed";
  const pct = failed ? 100 : Math.round(item.progress * 100);
  return (
    <span
      role="progressbar"
      aria-label={`Upload of ${item.name}`}
      aria-valuemin={0}
      aria-valuemax={100}
      aria-valuenow={pct}
      aria-invalid={failed || undefined}
      data-status={item.status}
      className="inline-block h-2 w-40 overflow-hidden rounded bg-slate-200"
    >
      <span className={`block h-full ${failed ? "bg-fail" : "bg-brand-600"}`} style={{ width: `${pct}%` }} />
    </span>
  );
}
