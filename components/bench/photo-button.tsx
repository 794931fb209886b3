"use client";

import { AlertText } from "@/components/ui/alert-text";
import { useId, useState } from "react";
import { Camera, LoaderCircle } from "lucide-react";
import { preparePhoto, type PreparedPhoto } from "@/lib/bench/photo";

/**
 * "Take photo": opens the rear camera on a phone (`capture="environment"`), or the file picker elsewhere. The
 * picture is downscaled to ≤ 1600 px JPEG and hashed (lib/bench/photo) before it is handed up.
 */
export function PhotoButton({
  onPhoto,
  label = "Take photo",
  disabled,
}: {
  onPhoto: (photo: PreparedPhoto) => void;
  label?: string;
  disabled?: boolean;
}) {
  const id = useId();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  return (
    <div className="flex flex-col gap-2">
      <label
        htmlFor={id}
        aria-disabled={disabled || busy ? true : undefined}
        className={
          "tap-bench inline-flex cursor-pointer items-center justify-center gap-3 rounded-2xl border-2 border-accent bg-surface px-5 " +
          "text-lg font-bold text-ink select-none has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-accent " +
          (disabled || busy ? "pointer-events-none opacity-60" : "active:bg-accent-soft")
        }
      >
        {busy ? <LoaderCircle aria-hidden size={26} className="animate-spin" /> : <Camera aria-hidden size={26} />}
        {busy ? "Preparing photo…" : label}
      </label>
      <input
        id={id}
        type="file"
        accept="image/*"
        capture="environment"
        className="sr-only"
        disabled={disabled || busy}
        onChange={async (e) => {
          const input = e.currentTarget;
          const file = input.files?.[0];
          if (!file) return;
          setBusy(true);
          setError(null);
          const r = await preparePhoto(file);
          setBusy(false);
          input.value = "";
          if (r.ok) onPhoto(r.value);
          else setError(r.message);
        }}
      />
      <AlertText message={error} />
    </div>
  );
}
