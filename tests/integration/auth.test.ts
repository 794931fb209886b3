import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { authenticate, INACTIVE_MESSAGE, INVALID_MESSAGE, sessionUser } from "@/lib/auth/authenticate";
import { RATE_LIMITS, recordFailure, lockedForMs, accountKey, addressKey } from "@/lib/auth/rate-limit";
import { createUser, resetPassword, setUserActive, setUserRole } from "@/lib/people/users";
import { AppError } from "@/lib/http/errors";
import { tempDb } from "./helpers/db";

let ctx: ReturnType<typeof tempDb>;
const PASSWORD = "a long enough password";

beforeEach(() => {
  process.env.BCRYPT_COST = "4";
  ctx = tempDb();
});
afterEach(() => ctx.cleanup());

async function person(email: string, role: "owner" | "counter" | "tech" = "tech") {
  return createUser(ctx.db, { name: email.split("@")[0]!, email, role, password: PASSWORD }, null);
}

describe("sign-in", () => {
  it("accepts the right password and refuses a wrong one", async () => {
    await person("ada@shop.test");
    const ok = await authenticate(ctx.db, { email: "ada@shop.test", password: PASSWORD }, "10.0.0.1");
    expect(ok).toMatchObject({ ok: true, user: { email: "ada@shop.test", role: "tech" } });
    const bad = await authenticate(ctx.db, { email: "ada@shop.test", password: PASSWORD + "x" }, "10.0.0.1");
    expect(bad).toEqual({ ok: false, reason: "invalid", message: INVALID_MESSAGE });
    const nobody = await authenticate(ctx.db, { email: "nobody@shop.test", password: PASSWORD }, "10.0.0.1");
    expect(nobody).toEqual({ ok: false, reason: "invalid", message: INVALID_MESSAGE });
  });

  it("locks an account after repeated failures, with a clear wait in minutes, even for the right password", async () => {
    await person("ben@shop.test");
    let last;
    for (let i = 0; i < RATE_LIMITS.account.maxFailures; i++) {
      last = await authenticate(ctx.db, { email: "ben@shop.test", password: "wrong" }, `10.0.1.${i}`);
    }
    expect(last).toMatchObject({ ok: false, reason: "rate_limited" });
    expect(last!.ok === false && last!.message).toMatch(/^Too many attempts\. Try again in 15 minutes\.$/);
    const right = await authenticate(ctx.db, { email: "ben@shop.test", password: PASSWORD }, "10.0.9.9");
    expect(right).toMatchObject({ ok: false, reason: "rate_limited" });
    // another account from another address is not affected
    await person("cy@shop.test");
    expect(await authenticate(ctx.db, { email: "cy@shop.test", password: PASSWORD }, "10.0.9.9")).toMatchObject({ ok: true });
  });

  it("locks an address that tries many accounts", async () => {
    for (let i = 0; i < RATE_LIMITS.address.maxFailures; i++) recordFailure(ctx.db, `guess${i}@shop.test`, "192.0.2.7");
    await person("dee@shop.test");
    expect(await authenticate(ctx.db, { email: "dee@shop.test", password: PASSWORD }, "192.0.2.7")).toMatchObject({ reason: "rate_limited" });
    expect(await authenticate(ctx.db, { email: "dee@shop.test", password: PASSWORD }, "192.0.2.8")).toMatchObject({ ok: true });
  });

  it("lets the lock run out and restarts the count after the window", () => {
    const t0 = 1_000_000;
    for (let i = 0; i < RATE_LIMITS.account.maxFailures; i++) recordFailure(ctx.db, "eve@shop.test", "198.51.100.1", t0);
    expect(lockedForMs(ctx.db, [accountKey("eve@shop.test")], t0)).toBe(RATE_LIMITS.account.lockMs);
    expect(lockedForMs(ctx.db, [accountKey("eve@shop.test")], t0 + RATE_LIMITS.account.lockMs + 1)).toBe(0);
    recordFailure(ctx.db, "eve@shop.test", "198.51.100.1", t0 + RATE_LIMITS.account.windowMs + 10);
    expect(lockedForMs(ctx.db, [accountKey("eve@shop.test"), addressKey("198.51.100.1")], t0 + RATE_LIMITS.account.windowMs + 10)).toBe(0);
  });

  it("clears an account's failures after a success", async () => {
    await person("fay@shop.test");
    for (let i = 0; i < RATE_LIMITS.account.maxFailures - 1; i++) {
      await authenticate(ctx.db, { email: "fay@shop.test", password: "wrong" }, "10.2.0.1");
    }
    await authenticate(ctx.db, { email: "fay@shop.test", password: PASSWORD }, "10.2.0.1");
    const after = await authenticate(ctx.db, { email: "fay@shop.test", password: "wrong" }, "10.2.0.1");
    expect(after).toMatchObject({ reason: "invalid" });
  });
});

describe("deactivation and sessions", () => {
  it("a switched-off person cannot sign in, and their existing session is refused on its next request", async () => {
    await person("own@shop.test", "owner");
    const id = await person("gus@shop.test");
    const signed = await authenticate(ctx.db, { email: "gus@shop.test", password: PASSWORD }, "10.3.0.1");
    if (!signed.ok) throw new Error("expected sign-in");
    expect(sessionUser(ctx.db, id, signed.user.sessionVersion)).not.toBeNull();
    setUserActive(ctx.db, id, false, null);
    expect(sessionUser(ctx.db, id, signed.user.sessionVersion)).toBeNull();
    expect(await authenticate(ctx.db, { email: "gus@shop.test", password: PASSWORD }, "10.3.0.1")).toEqual({
      ok: false,
      reason: "inactive",
      message: INACTIVE_MESSAGE,
    });
    // switched back on: a new sign-in works, the old session stays ended
    setUserActive(ctx.db, id, true, null);
    const again = await authenticate(ctx.db, { email: "gus@shop.test", password: PASSWORD }, "10.3.0.1");
    expect(again.ok).toBe(true);
    expect(sessionUser(ctx.db, id, signed.user.sessionVersion)).toBeNull();
  });

  it("a password reset ends the person's existing sessions", async () => {
    const id = await person("hal@shop.test");
    const signed = await authenticate(ctx.db, { email: "hal@shop.test", password: PASSWORD }, "10.4.0.1");
    if (!signed.ok) throw new Error("expected sign-in");
    await resetPassword(ctx.db, id, "another long password", null);
    expect(sessionUser(ctx.db, id, signed.user.sessionVersion)).toBeNull();
    expect(await authenticate(ctx.db, { email: "hal@shop.test", password: "another long password" }, "10.4.0.1")).toMatchObject({ ok: true });
  });

  it("keeps at least one active owner", async () => {
    const owner = await person("only@shop.test", "owner");
    expect(() => setUserActive(ctx.db, owner, false, null)).toThrow(AppError);
    expect(() => setUserRole(ctx.db, owner, "tech", null)).toThrow(/at least one active owner/);
  });

  it("refuses a second account with the same e-mail, in any letter case", async () => {
    await person("ivy@shop.test");
    await expect(person("IVY@shop.test")).rejects.toMatchObject({ code: "conflict", fields: { email: "Already in use." } });
  });
});
