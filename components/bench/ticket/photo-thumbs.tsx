"use client";

import { useEffect, useState } from "react";
import { CloudOff } from "lucide-react";
import type { PhotoWithBlob } from "@/lib/sync/read";

function usePhotoUrl(photo: PhotoWithBlob): string {
  const [url, setUrl] = useState<string>(photo.blob ? "" : `/api/photos/${photo.sha256}`);
  useEffect(() => {
    if (!photo.blob) {
      setUrl(`/api/photos/${photo.sha256}`);
      return;
    }
    const u = URL.createObjectURL(photo.blob);
    setUrl(u);
    return () => URL.revokeObjectURL(u);
  }, [photo.blob, photo.sha256]);
  return url;
}

function Thumb({ photo, label }: { photo: PhotoWithBlob; label: string }) {
  const url = usePhotoUrl(photo);
  return (
    <li className="relative">
      {url ? (
        // A blob: URL or the signed-in photo route; next/image cannot optimise either.
        // eslint-disable-next-line @next/next/no-img-element
        <img src={url} alt={label} className="h-24 w-24 rounded-xl border-2 border-line object-cover" data-testid="photo-thumb" />
      ) : (
        <span className="block h-24 w-24 rounded-xl border-2 border-line bg-surface-2" />
      )}
      {photo.blob ? (
        <span className="absolute bottom-1 left-1 inline-flex items-center gap-1 rounded-md bg-ink px-1.5 py-0.5 text-xs font-bold text-bg">
          <CloudOff aria-hidden size={12} /> on phone
        </span>
      ) : null}
    </li>
  );
}

/** Thumbnails of photos: from the phone's own copy until uploaded, then from the server. */
export function PhotoThumbs({ photos, label }: { photos: readonly PhotoWithBlob[]; label: string }) {
  if (photos.length === 0) return null;
  return (
    <ul className="flex flex-wrap gap-3" aria-label={`${label}: ${photos.length} photo${photos.length === 1 ? "" : "s"}`}>
      {photos.map((p, i) => (
        <Thumb key={p.id} photo={p} label={`${label}, photo ${i + 1}`} />
      ))}
    </ul>
  );
}
