import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { inviteSchema, setPasswordSchema } from "@/lib/users/schema";
import { parseInput } from "@/lib/validation";
import { readEnv } from "@/lib/env";

describe("shared form schemas", () => {
  it("normalises an invited e-mail and checks the role", () => {
    expect(inviteSchema.parse({ email: "  Wren@Shop.INVALID ", role: "porter" })).toEqual({ email: "wren@shop.invalid", role: "porter" });
    const bad = inviteSchema.safeParse({ email: "not-an-address", role: "boss" });
    expect(bad.success).toBe(false);
    const fields = bad.error!.issues.map((i) => i.path[0]);
    expect(fields).toEqual(expect.arrayContaining(["email", "role"]));
  });

  it("asks for ten characters and two matching passwords", () => {
    const short = setPasswordSchema.safeParse({ token: "x".repeat(20), password: "short", confirm: "short" });
    expect(short.error?.issues[0].message).toMatch(/at least 10/);
    const differ = setPasswordSchema.safeParse({ token: "x".repeat(20), password: "long-enough-1", confirm: "long-enough-2" });
    expect(differ.error?.issues[0].path).toEqual(["confirm"]);
  });

  it("turns a failed parse into a 422 with per-field messages", () => {
    try {
      parseInput(inviteSchema, { email: "", role: "porter" });
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(AppError);
      expect((err as AppError).status).toBe(422);
      expect((err as AppError).fields?.email?.[0]).toMatch(/valid e-mail/);
    }
  });
});

describe("configuration", () => {
  it("has working local defaults", () => {
    const env = readEnv({});
    expect(env.DATABASE_PATH).toBe("data/portolan.db");
    expect(env.S3_ENDPOINT).toBe("http://127.0.0.1:9310");
    expect(env.SMTP_PORT).toBe(1025);
  });

  it("names the variable that is wrong", () => {
    expect(() => readEnv({ SMTP_PORT: "seventy" })).toThrow(/SMTP_PORT/);
    expect(() => readEnv({ S3_ENDPOINT: "not a url" })).toThrow(/S3_ENDPOINT/);
  });
});
