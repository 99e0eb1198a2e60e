import { describe, expect, it } from "vitest";
import { revisionChangedMail, shippedMail } from "@/lib/jobs/mail";

describe("the shipped e-mail", () => {
  const input = {
    customerName: "Harrow & Vale Speed",
    contactName: "Odile <Marsh>",
    jobNumber: "J-2026-004",
    castingNumber: "HL-4471-A",
    shippedOn: "2026-12-04",
    heads: [
      {
        serial: "HV-0001",
        castingNumber: "HL-4471-A",
        ports: [{ port: "intake" as const, revisionLabel: "Street intake B", cutOn: "2026-12-02" }],
        flow: [{ port: "intake" as const, peakCfmAt28: 301.26, atLiftMm: 14, testedOn: "2026-12-03" }],
      },
      { serial: "HV-0002", castingNumber: "HL-4471-A", ports: [], flow: [] },
    ],
  };
  it("lists each head with its revisions and flow, in text and escaped HTML", () => {
    const m = shippedMail(input);
    expect(m.subject).toBe("Job J-2026-004 has shipped: 2 heads of casting HL-4471-A");
    expect(m.text).toContain("Hello Odile <Marsh>,");
    expect(m.text).toContain("Intake ports cut with Street intake B on 2026-12-02");
    expect(m.text).toContain("Intake flow 301.3 cfm at 28 inH2O (lift 14.00 mm)");
    expect(m.text).toContain("No flow test recorded on this head.");
    expect(m.html).toContain("Odile &lt;Marsh&gt;");
    expect(m.html).not.toContain("<Marsh>");
    expect(m.text).toMatch(/estimates/);
  });
});

describe("the revision-changed e-mail", () => {
  it("names the revision, its new state, the reason and each job with a link", () => {
    const m = revisionChangedMail({
      revisionLabel: "Street intake A",
      newState: "superseded",
      reason: "superseded by revision B",
      jobs: [{ number: "J-2026-002", customerName: "Pellucid", state: "Scheduled", link: "http://127.0.0.1:3000/jobs/2" }],
    });
    expect(m.subject).toBe("Street intake A was superseded: 1 open job uses it");
    expect(m.text).toContain("(superseded by revision B)");
    expect(m.text).toContain("Job J-2026-002 for Pellucid (Scheduled): http://127.0.0.1:3000/jobs/2");
    expect(() => revisionChangedMail({ revisionLabel: "x", newState: "withdrawn", jobs: [{ number: "1", customerName: "c", state: "s", link: "javascript:alert(1)" }] })).toThrow(/http/);
  });
});
