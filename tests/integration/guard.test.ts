import { beforeEach, describe, expect, it, vi } from "vitest";

const session = vi.hoisted(() => ({ current: null as null | { user: { id: string; email: string; name: string; role: string } } }));
vi.mock("@/lib/auth/auth", () => ({ auth: vi.fn(async () => session.current) }));

import { requirePageUser, requireUser } from "@/lib/auth/guard";
import { ROLES, type Role } from "@/lib/auth/roles";
import { GET as me } from "@/app/api/me/route";

process.env.__NEXT_EXPERIMENTAL_AUTH_INTERRUPTS = "true";

function signInAs(role: Role | null) {
  session.current = role ? { user: { id: `id-${role}`, email: `${role}@shop.test`, name: role, role } } : null;
}

/** The access rules the app's pages and routes use. */
const AREAS: Array<{ area: string; roles: Role[] }> = [
  { area: "owner pages", roles: ["owner"] },
  { area: "counter pages", roles: ["counter", "owner"] },
  { area: "any signed-in user (bench API)", roles: [] },
];

beforeEach(() => signInAs(null));

describe("requireUser", () => {
  for (const { area, roles } of AREAS) {
    for (const role of ROLES) {
      const allowed = roles.length === 0 || roles.includes(role);
      it(`${allowed ? "allows" : "refuses"} ${role} for ${area}`, async () => {
        signInAs(role);
        const attempt = requireUser(...roles);
        if (allowed) await expect(attempt).resolves.toMatchObject({ role });
        else await expect(attempt).rejects.toMatchObject({ code: "forbidden", status: 403 });
      });
    }
  }

  it("refuses with 'unauthorized' when nobody is signed in", async () => {
    await expect(requireUser()).rejects.toMatchObject({ code: "unauthorized", status: 401 });
  });
});

describe("requirePageUser", () => {
  it("sends a signed-out visitor to sign-in, keeping where they were going", async () => {
    await expect(requirePageUser("/owner/people", "owner")).rejects.toMatchObject({
      digest: expect.stringMatching(/^NEXT_REDIRECT;[a-z]+;\/sign-in\?next=%2Fowner%2Fpeople;/),
    });
  });

  it("shows the not-allowed page (403) to the wrong role", async () => {
    signInAs("tech");
    await expect(requirePageUser("/owner/people", "owner")).rejects.toMatchObject({ digest: "NEXT_HTTP_ERROR_FALLBACK;403" });
  });
});

describe("GET /api/me", () => {
  it("answers 401 in the one error shape when signed out", async () => {
    const res = await me(new Request("http://test/api/me"), undefined);
    expect(res.status).toBe(401);
    expect(await res.json()).toEqual({ error: { code: "unauthorized", message: "Sign in to continue." } });
  });

  it("answers the signed-in user", async () => {
    signInAs("counter");
    const res = await me(new Request("http://test/api/me"), undefined);
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ user: { id: "id-counter", email: "counter@shop.test", name: "counter", role: "counter" } });
  });
});
