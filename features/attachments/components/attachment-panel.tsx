"use client";

import { useState, type DragEvent } from "react";
import useSWR from "swr";
import { buttonStyles } from "@/features/ui/button-styles";
import { fetchJson } from "@/features/ui/fetch-json";
import { attachmentsKey, attachmentUrl } from "../cache-keys";
import { ACCEPTED_KINDS_TEXT, MAX_ATTACHMENT_BYTES, type AttachmentListDto } from "../model/dto";
import { uploadFile } from "./upload-file";
import { formatUtcMinute } from "@/features/ui/format-when";

// The Drawing drawer: datasheets, photos and drawings attached to a design. Files are dropped or
// chosen, sent one by one with a progress bar, and checked by the server by content.
interface Props {
  designId: string;
  canUpload: boolean;
  canDeleteAny: boolean;
  viewerId: string;
}

interface Pending {
  key: string;
  name: string;
  progress: number;
  error?: string;
}

const fetcher = (url: string) => fetchJson<AttachmentListDto>(url, "The attachments could not be loaded.");

function size(bytes: number): string {
  return bytes >= 1024 * 1024
    ? `${(bytes / 1024 / 1024).toFixed(1)} MB`
    : `${Math.max(1, Math.round(bytes / 1024))} kB`;
}

export function AttachmentPanel({ designId, canUpload, canDeleteAny, viewerId }: Props) {
  const key = attachmentsKey(designId);
  const { data, error, mutate } = useSWR(key, fetcher);
  const [pending, setPending] = useState<Pending[]>([]);
  const [over, setOver] = useState(false);
  const [status, setStatus] = useState("");

  async function send(files: FileList | File[]) {
    for (const file of Array.from(files)) {
      const k = `${file.name}-${file.size}-${Date.now()}`;
      if (file.size > MAX_ATTACHMENT_BYTES) {
        setPending((p) => [
          ...p,
          {
            key: k,
            name: file.name,
            progress: 0,
            error: `larger than ${MAX_ATTACHMENT_BYTES / 1024 / 1024} MB`,
          },
        ]);
        continue;
      }
      setPending((p) => [...p, { key: k, name: file.name, progress: 0 }]);
      const outcome = await uploadFile(key, file, (f) =>
        setPending((p) => p.map((x) => (x.key === k ? { ...x, progress: f } : x))),
      );
      if (outcome.ok) {
        setPending((p) => p.filter((x) => x.key !== k));
        setStatus(`Attached ${file.name}.`);
        await mutate();
      } else {
        setPending((p) =>
          p.map((x) => (x.key === k ? { ...x, error: outcome.message ?? `refused (${outcome.status})` } : x)),
        );
        setStatus(`${file.name} was not attached: ${outcome.message ?? outcome.status}`);
      }
    }
  }

  async function remove(id: string, name: string) {
    if (!window.confirm(`Remove ${name} from this design?`)) return;
    const res = await fetch(attachmentUrl(designId, id), { method: "DELETE" });
    const body = await res.json().catch(() => null);
    setStatus(res.ok ? `Removed ${name}.` : (body?.error?.message ?? "Not removed."));
    await mutate();
  }

  const onDrop = (e: DragEvent) => {
    e.preventDefault();
    setOver(false);
    if (canUpload && e.dataTransfer.files.length) void send(e.dataTransfer.files);
  };

  return (
    <section
      aria-label="Drawing drawer"
      className="flex flex-col gap-3 rounded-plate border border-ink-100 bg-white p-panel shadow-plate"
    >
      <h2 className="text-lead font-semibold">Drawing drawer</h2>
      {canUpload ? (
        <div
          onDragOver={(e) => {
            e.preventDefault();
            setOver(true);
          }}
          onDragLeave={() => setOver(false)}
          onDrop={onDrop}
          data-testid="attachment-drop-zone"
          className={`flex flex-col items-center gap-2 rounded-plate border-2 border-dashed px-4 py-6 text-center text-table ${over ? "border-brass-500 bg-brass-50" : "border-ink-200 bg-steel-50"}`}
        >
          <p>
            Drop {ACCEPTED_KINDS_TEXT} files here (up to {MAX_ATTACHMENT_BYTES / 1024 / 1024} MB each)
          </p>
          <label className={buttonStyles.secondary}>
            Choose files
            <input
              type="file"
              multiple
              className="sr-only"
              aria-label="Attach files"
              onChange={(e) => {
                if (e.target.files) void send(e.target.files);
                e.target.value = "";
              }}
            />
          </label>
        </div>
      ) : null}
      {pending.length > 0 ? (
        <ul className="flex w-full flex-col gap-2">
          {pending.map((p) => (
            <li key={p.key} className="w-full text-table">
              <div className="flex justify-between gap-2">
                <span>{p.name}</span>
                {p.error ? (
                  <span className="text-verdict-fail">{p.error}</span>
                ) : (
                  <span className="num">{Math.round(p.progress * 100)} %</span>
                )}
              </div>
              {!p.error ? (
                <progress
                  max={1}
                  value={p.progress}
                  aria-label={`Uploading ${p.name}`}
                  className="block h-1.5 w-full accent-brass-500"
                />
              ) : (
                <button
                  type="button"
                  className="text-micro underline"
                  onClick={() => setPending((all) => all.filter((x) => x.key !== p.key))}
                >
                  Dismiss
                </button>
              )}
            </li>
          ))}
        </ul>
      ) : null}
      <p role="status" aria-live="polite" className="min-h-5 text-table text-ink-700">
        {status}
      </p>
      {error ? <p className="text-table text-verdict-fail">{error.message}</p> : null}
      {data && data.attachments.length === 0 ? (
        <p className="text-table text-ink-500">Nothing attached yet.</p>
      ) : null}
      {data && data.attachments.length > 0 ? (
        <div className="max-w-full overflow-x-auto">
          <table className="w-full text-table" aria-label="Attachments">
            <thead className="text-left text-ink-600">
              <tr>
                <th className="py-1 font-medium">File</th>
                <th className="font-medium">Kind</th>
                <th className="font-medium">Size</th>
                <th className="font-medium">Attached by</th>
                <th className="font-medium">When</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {data.attachments.map((a) => (
                <tr key={a.id} className="border-t border-ink-100">
                  <td className="py-1.5">
                    <a
                      href={attachmentUrl(designId, a.id)}
                      download={a.fileName}
                      className="text-ink-900 underline underline-offset-2"
                    >
                      {a.fileName}
                    </a>
                  </td>
                  <td className="uppercase">{a.kind}</td>
                  <td className="num">{size(a.sizeBytes)}</td>
                  <td>{a.uploadedByName}</td>
                  <td className="num">
                    <time dateTime={a.createdAt}>{formatUtcMinute(a.createdAt)}</time>
                  </td>
                  <td className="text-right">
                    {!data.locked && (canDeleteAny || a.uploadedById === viewerId) ? (
                      <button
                        type="button"
                        onClick={() => remove(a.id, a.fileName)}
                        className="text-verdict-fail underline-offset-2 hover:underline"
                        aria-label={`Remove ${a.fileName}`}
                      >
                        Remove
                      </button>
                    ) : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      {data?.locked ? (
        <p className="text-micro text-ink-500">
          The working revision is approved: attachments are kept as they are.
        </p>
      ) : null}
    </section>
  );
}
