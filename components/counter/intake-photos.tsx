"use client";

import { useEffect, useRef, useState } from "react";
import { Camera, X } from "lucide-react";
import { preparePhoto } from "@/lib/bench/photo";
import { INTAKE_PHOTOS_MAX, type IntakePhoto } from "@/lib/counter/intake-schema";
import { buttonClass } from "@/components/ui/button";

/**
 * Photos of the machine's condition at intake: each one is downscaled and hashed in the browser, uploaded to
 * the photo store at once (PUT /api/photos/<sha256>, idempotent), and only then listed for the form to send.
 */
export function IntakePhotos({ value, onChange, error }: { value: IntakePhoto[]; onChange: (next: IntakePhoto[]) => void; error?: string }) {
  const [busy, setBusy] = useState(0);
  const [problem, setProblem] = useState<string | null>(null);
  const [previews, setPreviews] = useState<Record<string, string>>({});
  const input = useRef<HTMLInputElement>(null);
  const latest = useRef(value);
  latest.current = value;

  useEffect(() => () => Object.values(previews).forEach((u) => URL.revokeObjectURL(u)), [previews]);

  async function add(files: FileList | null) {
    setProblem(null);
    for (const file of Array.from(files ?? [])) {
      if (latest.current.length >= INTAKE_PHOTOS_MAX) {
        setProblem(`Keep it to ${INTAKE_PHOTOS_MAX} photos.`);
        break;
      }
      setBusy((n) => n + 1);
      try {
        const prepared = await preparePhoto(file);
        if (!prepared.ok) {
          setProblem(prepared.message);
          continue;
        }
        const p = prepared.value;
        const res = await fetch(`/api/photos/${p.sha256}`, { method: "PUT", body: p.blob, headers: { "Content-Type": p.mime } }).catch(() => null);
        if (!res || !res.ok) {
          const body = res ? ((await res.json().catch(() => null)) as { error?: { message?: string } } | null) : null;
          setProblem(body?.error?.message ?? "The photo could not be sent (no network?). Try again when the network is back.");
          continue;
        }
        if (!latest.current.some((x) => x.sha256 === p.sha256)) {
          const next = [...latest.current, { sha256: p.sha256, mime: p.mime, bytes: p.bytes, width: p.width, height: p.height }];
          latest.current = next;
          onChange(next);
          setPreviews((prev) => ({ ...prev, [p.sha256]: URL.createObjectURL(p.blob) }));
        }
      } finally {
        setBusy((n) => n - 1);
      }
    }
    if (input.current) input.current.value = "";
  }

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-3">
        <label className={buttonClass("secondary", "md", "cursor-pointer")}>
          <Camera size={20} aria-hidden />
          {busy ? "Adding photo…" : "Add a photo"}
          <input ref={input} type="file" accept="image/*" multiple className="sr-only" onChange={(e) => void add(e.target.files)} data-testid="intake-photo-input" />
        </label>
        <span className="text-sm text-muted">
          {value.length} of {INTAKE_PHOTOS_MAX} · optional: damage, missing parts, fuel left in
        </span>
      </div>
      {value.length ? (
        <ul className="flex flex-wrap gap-3" aria-label="Intake photos">
          {value.map((p, i) => (
            <li key={p.sha256} className="relative">
              {/* eslint-disable-next-line @next/next/no-img-element -- local preview or our own photo API */}
              <img src={previews[p.sha256] ?? `/api/photos/${p.sha256}`} alt={`Intake photo ${i + 1}`} className="size-24 rounded-xl border border-line object-cover" />
              <button
                type="button"
                onClick={() => onChange(value.filter((x) => x.sha256 !== p.sha256))}
                className="tap absolute -top-3 -right-3 grid place-items-center rounded-full border-2 border-line bg-surface"
                aria-label={`Remove intake photo ${i + 1}`}
              >
                <X size={18} aria-hidden />
              </button>
            </li>
          ))}
        </ul>
      ) : null}
      {problem || error ? (
        <p role="alert" className="font-semibold text-bad">
          {problem ?? error}
        </p>
      ) : null}
    </div>
  );
}
