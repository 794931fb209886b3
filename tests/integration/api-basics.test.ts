import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { z, ZodError } from "zod";
import { GET as health } from "@/app/api/health/route";
import { route, readJson } from "@/lib/http/route";
import { AppError, toErrorBody } from "@/lib/http/errors";
import { closeDb } from "@/db/client";
import { tempDb } from "./helpers/db";

let ctx: ReturnType<typeof tempDb>;
beforeEach(() => {
  ctx = tempDb();
  closeDb();
});
afterEach(() => {
  closeDb();
  ctx.cleanup();
});

describe("GET /api/health", () => {
  it("answers 200 with ok:true once the database answers", async () => {
    const res = await health(new Request("http://test/api/health"), undefined);
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ ok: true, db: "ok" });
  });
});

describe("the one error shape", () => {
  const echo = route(async (req: Request) => {
    const body = await readJson(req, z.object({ phone: z.string().regex(/^\d{3}-\d{4}$/, "Use the form 555-0100.") }));
    return Response.json(body);
  });

  it("bad JSON is a 400 validation error, not a 500", async () => {
    const res = await echo(new Request("http://test", { method: "POST", body: "{not json" }), undefined);
    expect(res.status).toBe(400);
    expect(await res.json()).toEqual({ error: { code: "validation", message: "The request body is not valid JSON." } });
  });

  it("a zod failure names the field", async () => {
    const res = await echo(new Request("http://test", { method: "POST", body: JSON.stringify({ phone: "12" }) }), undefined);
    expect(res.status).toBe(400);
    expect(await res.json()).toEqual({
      error: { code: "validation", message: "Some fields need attention.", fields: { phone: "Use the form 555-0100." } },
    });
  });

  it("maps every code to its HTTP status", () => {
    const cases: Array<[ConstructorParameters<typeof AppError>[0], number]> = [
      ["validation", 400], ["unauthorized", 401], ["forbidden", 403], ["not_found", 404], ["conflict", 409], ["rate_limited", 429], ["internal", 500],
    ];
    for (const [code, status] of cases) expect(toErrorBody(new AppError(code, "m")).status).toBe(status);
  });

  it("an unexpected error becomes 'internal' without leaking its message", async () => {
    const logged = vi.spyOn(console, "error").mockImplementation(() => {});
    const boom = route(async () => {
      throw new Error("secret detail");
    });
    const res = await boom(new Request("http://test"), undefined);
    expect(res.status).toBe(500);
    const body = await res.json();
    expect(body.error.code).toBe("internal");
    expect(JSON.stringify(body)).not.toContain("secret detail");
    expect(logged).toHaveBeenCalledOnce();
    logged.mockRestore();
  });

  it("ZodError thrown anywhere is a 400", () => {
    expect(toErrorBody(new ZodError([])).status).toBe(400);
  });
});
