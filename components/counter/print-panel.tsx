import { FileDown, Printer } from "lucide-react";
import { buttonClass } from "@/components/ui/button";

const QUICK = [
  ["label-4x2", "2 × 4 in label"],
  ["roll-62", "62 mm roll"],
] as const;

/**
 * Print links for a tag or sticker PDF: one-label layouts open at once; sheets ask which label on the
 * sheet is the first free one. Plain links and a GET form, so printing works even before scripts load.
 */
export function PrintPanel({ href, what, idPrefix }: { href: string; what: string; idPrefix: string }) {
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap gap-2">
        {QUICK.map(([layout, label]) => (
          <a key={layout} href={`${href}?layout=${layout}`} target="_blank" rel="noopener" className={buttonClass("primary")} data-layout={layout}>
            <Printer size={18} aria-hidden /> Print {what}: {label}
          </a>
        ))}
      </div>
      <form action={href} method="get" target="_blank" className="flex flex-wrap items-end gap-2">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${idPrefix}-layout`} className="text-sm font-semibold">
            Sheet
          </label>
          <select id={`${idPrefix}-layout`} name="layout" defaultValue="sheet-letter" className="tap rounded-xl border-2 border-line bg-surface px-3">
            <option value="sheet-letter">Letter, 10 labels</option>
            <option value="sheet-a4">A4, 10 labels</option>
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${idPrefix}-start`} className="text-sm font-semibold">
            First free label
          </label>
          <select id={`${idPrefix}-start`} name="start" defaultValue="1" className="tap rounded-xl border-2 border-line bg-surface px-3">
            {Array.from({ length: 10 }, (_, i) => (
              <option key={i} value={i + 1}>
                {i + 1} {i % 2 === 0 ? "(left)" : "(right)"}, row {Math.floor(i / 2) + 1}
              </option>
            ))}
          </select>
        </div>
        <button type="submit" className={buttonClass("secondary")}>
          <FileDown size={18} aria-hidden /> Sheet PDF
        </button>
      </form>
    </div>
  );
}
