import { afterEach, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { PDFDocument, StandardFonts } from "pdf-lib";

const session = vi.hoisted(() => ({ current: null as unknown }));
vi.mock("@/lib/auth/auth", () => ({ auth: vi.fn(async () => session.current) }));

import { closeDb } from "@/db/client";
import { code128Modules, drawable, LAYOUTS, labelsPdf, mm, type TagLabel } from "@/lib/counter/labels";
import { issueSticker } from "@/lib/counter/tags";
import { GET as ticketLabel } from "@/app/api/labels/tickets/[id]/route";
import { GET as machineLabel } from "@/app/api/labels/machines/[id]/route";
import { GET as sheet } from "@/app/api/labels/sheet/route";
import { formatTagCode } from "@/lib/trade/tag-code";
import { decodeCode128, pdfText, renderPdfPage } from "../fixtures/barcode";
import { tempDb } from "./helpers/db";
import { addCustomer, addMachine, addTicket, makeShop, PEOPLE, sessionFor } from "./helpers/shop";

const LABEL: TagLabel = { code: "HKRTNAD", kind: "ticket", heading: "#1004", corner: "1 Dec 2026", who: "ASHDOWN", what: "Varnholt VH-451 chain saw" };

async function pageSizes(pdf: Uint8Array) {
  const doc = await PDFDocument.load(pdf);
  return doc.getPages().map((p) => p.getSize());
}

/** Crop box of a layout's cell, measured from the page's top-left (as pdftoppm crops). */
function cellCrop(layoutId: keyof typeof LAYOUTS, index: number) {
  const l = LAYOUTS[layoutId];
  const c = l.cells[index]!;
  return { x: c.x, y: l.page.h - c.y - c.h, w: c.w, h: c.h };
}

describe("label layouts", () => {
  it("have the paper sizes they are named for", async () => {
    // [ISO 32000-1 §8.3.2.3, memory for the clause] PDF default user space unit = 1/72 in; [16 CFR 500.19 / NIST] 1 in = 25.4 mm
    expect(await pageSizes(await labelsPdf([LABEL], "label-4x2"))).toEqual([{ width: 288, height: 144 }]);
    const roll = (await pageSizes(await labelsPdf([LABEL], "roll-62")))[0]!;
    expect(roll.width).toBeCloseTo((100 / 25.4) * 72, 3);
    expect(roll.height).toBeCloseTo(175.748, 3); // 62 mm
    // [ANSI/ASME Y14.1 size A, memory] US Letter 8.5 × 11 in = 612 × 792 pt
    expect(await pageSizes(await labelsPdf([LABEL], "sheet-letter"))).toEqual([{ width: 612, height: 792 }]);
    // [ISO 216] A4 = 210 × 297 mm ≈ 595.28 × 841.89 pt
    const a4 = (await pageSizes(await labelsPdf([LABEL], "sheet-a4")))[0]!;
    expect(a4.width).toBeCloseTo(595.28, 2);
    expect(a4.height).toBeCloseTo(841.89, 2);
  });

  it("lay sheets out as 10 labels that stay on the page and never overlap", () => {
    for (const id of ["sheet-letter", "sheet-a4"] as const) {
      const { page, cells } = LAYOUTS[id];
      expect(cells).toHaveLength(10);
      for (const c of cells) {
        expect(c.x).toBeGreaterThanOrEqual(0);
        expect(c.y).toBeGreaterThanOrEqual(-1e-9);
        expect(c.x + c.w).toBeLessThanOrEqual(page.w + 1e-9);
        expect(c.y + c.h).toBeLessThanOrEqual(page.h + 1e-9);
      }
      for (const [i, a] of cells.entries()) {
        for (const b of cells.slice(i + 1)) {
          const apart = a.x + a.w <= b.x + 1e-9 || b.x + b.w <= a.x + 1e-9 || a.y + a.h <= b.y + 1e-9 || b.y + b.h <= a.y + 1e-9;
          expect(apart).toBe(true);
        }
      }
    }
    // Letter: two 4 in columns + 2 × 5/32 in + 3/16 in = 8.5 in; five 2 in rows + 2 × 0.5 in = 11 in
    expect(LAYOUTS["sheet-letter"].cells[1]!.x + LAYOUTS["sheet-letter"].cells[1]!.w).toBeCloseTo(612 - (5 / 32) * 72, 6);
    expect(LAYOUTS["sheet-a4"].cells[0]!.h).toBeCloseTo(mm(57), 6);
  });
});

describe("the barcode", () => {
  it("is Code 128 with the standard's symbol widths", () => {
    // [ISO/IEC 15417, memory] start (11 modules) + 7 data × 11 + check (11) + stop (13) = 112 modules,
    // 6 bars and spaces per character and 7 in the stop pattern = 61 elements, each 1–4 modules wide
    const bars = code128Modules("HKRTNAD");
    expect(bars.reduce((a, b) => a + b, 0)).toBe(112);
    expect(bars).toHaveLength(61);
    expect(bars.every((w) => w >= 1 && w <= 4)).toBe(true);
  });

  for (const layout of ["label-4x2", "roll-62"] as const) {
    it(`on a ${layout} page decodes with an independent reader to the tag code`, async () => {
      const pdf = await labelsPdf([LABEL], layout);
      // [ISO/IEC 15417 via @zxing/library] the reader checks the mod-103 check character itself
      expect(decodeCode128(renderPdfPage(pdf, { dpi: 200 }))).toBe("HKRTNAD");
      expect(pdfText(pdf)).toMatch(/#1004[\s\S]*HKR-TNAD[\s\S]*ASHDOWN/);
    });
  }

  it("on a sheet lands in the starting position, leaving earlier labels blank, and flows onto a new page", async () => {
    const labels = ["HKRTNAD", "346789A", "PJJ7XKC"].map((code, i) => ({ ...LABEL, code, heading: `#${1004 + i}` }));
    for (const l of labels.slice(1)) expect(formatTagCode(l.code)).toHaveLength(8);
    const pdf = await labelsPdf(labels, "sheet-letter", { start: 9 });
    expect(await pageSizes(pdf)).toHaveLength(2);
    expect(decodeCode128(renderPdfPage(pdf, { dpi: 200, crop: cellCrop("sheet-letter", 8) }))).toBe("HKRTNAD");
    expect(decodeCode128(renderPdfPage(pdf, { dpi: 200, crop: cellCrop("sheet-letter", 9) }))).toBe("346789A");
    expect(decodeCode128(renderPdfPage(pdf, { page: 2, dpi: 200, crop: cellCrop("sheet-letter", 0) }))).toBe("PJJ7XKC");
    // A blank cell has no barcode (zxing warns on the console while it looks; keep the run quiet).
    const quiet = vi.spyOn(console, "warn").mockImplementation(() => {});
    expect(() => decodeCode128(renderPdfPage(pdf, { dpi: 200, crop: cellCrop("sheet-letter", 0) }))).toThrow();
    quiet.mockRestore();
  });

  it("prints names the standard fonts cannot draw without failing", async () => {
    const doc = await PDFDocument.create();
    const font = await doc.embedFont(StandardFonts.Helvetica);
    expect(drawable(font, "Łódź Ærø Đaković 北")).toBe("Lódz Ærø Dakovic ?") // ó and Æ are in WinAnsi; ź, Đ, ć are not;
    const pdf = await labelsPdf([{ ...LABEL, who: "ŁUKASZEWICZ", what: "Ōtsuki 北 saw" }], "label-4x2");
    expect(pdfText(pdf)).toContain("LUKASZEWICZ");
  });
});

describe("label routes", () => {
  let ctx: ReturnType<typeof tempDb>;
  beforeAll(() => undefined);
  beforeEach(() => {
    ctx = tempDb();
    closeDb();
    makeShop(ctx.db);
    session.current = sessionFor(PEOPLE.counter);
  });
  afterEach(() => {
    closeDb();
    ctx.cleanup();
  });
  const params = (id: string) => ({ params: Promise.resolve({ id }) });

  it("serve a ticket's tag as a PDF that decodes to its current code", async () => {
    const cust = addCustomer(ctx.db, { lastName: "Quenby" });
    const t = addTicket(ctx.db, { machineId: addMachine(ctx.db, cust, { make: "Tarnwick", model: "TW-40" }), customerId: cust });
    const res = await ticketLabel(new Request(`http://test/api/labels/tickets/${t.id}?layout=roll-62`), params(t.id));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    const pdf = new Uint8Array(await res.arrayBuffer());
    expect(decodeCode128(renderPdfPage(pdf))).toBe(t.tagCode);
    expect(pdfText(pdf)).toMatch(new RegExp(`#${t.number}[\\s\\S]*${formatTagCode(t.tagCode)}[\\s\\S]*QUENBY Tarnwick TW-40 chain saw`));
  });

  it("refuse an unknown layout (400), an unknown ticket (404) and the signed-out (401)", async () => {
    const cust = addCustomer(ctx.db);
    const t = addTicket(ctx.db, { machineId: addMachine(ctx.db, cust), customerId: cust });
    const bad = await ticketLabel(new Request(`http://test/api/labels/tickets/${t.id}?layout=poster`), params(t.id));
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.fields.layout).toMatch(/Choose a layout/);
    expect((await ticketLabel(new Request(`http://test/api/labels/tickets/x?start=11&layout=sheet-a4`), params("x"))).status).toBe(400);
    expect((await ticketLabel(new Request("http://test/api/labels/tickets/x"), params("x"))).status).toBe(404);
    session.current = null;
    expect((await ticketLabel(new Request(`http://test/api/labels/tickets/${t.id}`), params(t.id))).status).toBe(401);
  });

  it("serve a sticker once the machine has one, on any layout", async () => {
    const m = addMachine(ctx.db, addCustomer(ctx.db), { serial: "TW40-0042" });
    const before = await machineLabel(new Request(`http://test/api/labels/machines/${m}`), params(m));
    expect(before.status).toBe(404);
    expect((await before.json()).error.message).toMatch(/no sticker yet/);
    const code = issueSticker(ctx.db, { machineId: m, actorId: null });
    const res = await machineLabel(new Request(`http://test/api/labels/machines/${m}?layout=sheet-a4&start=4`), params(m));
    const pdf = new Uint8Array(await res.arrayBuffer());
    expect(decodeCode128(renderPdfPage(pdf, { crop: cellCrop("sheet-a4", 3) }))).toBe(code);
    expect(pdfText(pdf)).toContain("s/n TW40-0042");
  });

  it("print several tickets on one sheet in the order asked", async () => {
    const cust = addCustomer(ctx.db);
    const ts = [1, 2, 3].map(() => addTicket(ctx.db, { machineId: addMachine(ctx.db, cust), customerId: cust }));
    const ids = [ts[2]!, ts[0]!, ts[1]!];
    const res = await sheet(new Request(`http://test/api/labels/sheet?layout=sheet-letter&tickets=${ids.map((t) => t.id).join(",")}`), undefined);
    const pdf = new Uint8Array(await res.arrayBuffer());
    const decoded = [0, 1, 2].map((i) => decodeCode128(renderPdfPage(pdf, { crop: cellCrop("sheet-letter", i) })));
    expect(decoded).toEqual(ids.map((t) => t.tagCode));
    expect((await sheet(new Request("http://test/api/labels/sheet?tickets="), undefined)).status).toBe(400);
  });
});
