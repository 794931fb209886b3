import { and, asc, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { photos } from "@/db/schema";
import { INTAKE_PHOTO_STEP } from "@/lib/counter/bench-sheet-view";

/** The photos the counter took when the machine came in. */
export function IntakePhotoStrip({ ticketId }: { ticketId: string }) {
  const list = getDb()
    .select({ id: photos.id, sha256: photos.sha256 })
    .from(photos)
    .where(and(eq(photos.ticketId, ticketId), eq(photos.stepId, INTAKE_PHOTO_STEP)))
    .orderBy(asc(photos.at))
    .all();
  if (!list.length) return <p className="mt-4 text-sm text-muted">No photos taken at intake.</p>;
  return (
    <ul className="mt-4 flex flex-wrap gap-2" aria-label="Photos taken at intake">
      {list.map((p, i) => (
        <li key={p.id}>
          <a href={`/api/photos/${p.sha256}`} target="_blank" rel="noreferrer">
            {/* eslint-disable-next-line @next/next/no-img-element -- private photos served by our own API */}
            <img src={`/api/photos/${p.sha256}`} alt={`Intake photo ${i + 1}`} loading="lazy" className="size-24 rounded-xl border border-line object-cover" />
          </a>
        </li>
      ))}
    </ul>
  );
}
