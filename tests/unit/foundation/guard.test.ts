import { describe, expect, it } from "vitest";
import { hasRole, requireRole, type Actor } from "@/lib/auth/guard";
import { ADMINS, EVERYONE, LEADS } from "@/lib/auth/roles";
import { AppError } from "@/lib/errors";

const porter: Actor = { id: 1, email: "p@x.invalid", name: "P", role: "porter" };
const admin: Actor = { id: 2, email: "a@x.invalid", name: "A", role: "admin" };

describe("requireRole", () => {
  it("refuses nobody with 401", () => {
    try {
      requireRole(null, EVERYONE);
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(AppError);
      expect((err as AppError).status).toBe(401);
    }
  });

  it("refuses a role outside the list with 403", () => {
    expect(() => requireRole(porter, ADMINS)).toThrowError(expect.objectContaining({ code: "forbidden", status: 403 }));
  });

  it("returns the actor when the role is listed", () => {
    expect(requireRole(admin, LEADS)).toBe(admin);
    expect(hasRole(porter, LEADS)).toBe(false);
    expect(hasRole(admin, LEADS)).toBe(true);
  });
});
