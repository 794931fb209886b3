import { describe, expect, it } from "vitest";
import { hashPassword, verifyPassword } from "@/lib/auth/password";

describe("password hashing (bcrypt)", () => {
  it("verifies a published bcrypt test vector", async () => {
    // [Openwall crypt_blowfish test vectors, from memory] "U*U" with cost 5 and salt "CCCCCCCCCCCCCCCCCCCCC."
    expect(await verifyPassword("U*U", "$2a$05$CCCCCCCCCCCCCCCCCCCCC.E5YPO9kmyuRGyh0XouQYb4YMJKvyOeW")).toBe(true);
    expect(await verifyPassword("U*V", "$2a$05$CCCCCCCCCCCCCCCCCCCCC.E5YPO9kmyuRGyh0XouQYb4YMJKvyOeW")).toBe(false);
  });

  it("hashes with a fresh salt each time and the cost factor set", async () => {
    process.env.BCRYPT_COST = "6";
    const a = await hashPassword("correct horse battery");
    const b = await hashPassword("correct horse battery");
    expect(a).not.toBe(b);
    expect(a).toMatch(/^\$2[aby]\$06\$/);
    expect(await verifyPassword("correct horse battery", a)).toBe(true);
    expect(await verifyPassword("correct horse batterY", a)).toBe(false);
  });

  it("answers false (never throws) for a malformed stored hash", async () => {
    expect(await verifyPassword("x", "not-a-hash")).toBe(false);
  });
});
