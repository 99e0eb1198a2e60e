/**
 * The e-mails of jobs as pure functions: facts in, `{ subject, text, html }` out. Plain text
 * first (many shop inboxes show only that), the HTML is the same words; every value is escaped.
 */
import type { Port } from "@/db/enums";
import { PORT_LABEL, REVISION_STATE_LABEL } from "./words";

export type MailContent = { subject: string; text: string; html: string };

function esc(value: string): string {
  return value.replace(/[&<>"']/g, (ch) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[ch]!);
}

function checkedLink(link: string): string {
  const url = new URL(link);
  if (url.protocol !== "https:" && url.protocol !== "http:") throw new Error(`mail link must be http(s): ${link}`);
  return url.href;
}

function page(title: string, blocks: string[]): string {
  return (
    `<!doctype html><html><head><meta charset="utf-8"><title>${esc(title)}</title></head>` +
    `<body style="margin:0;padding:24px;background:#f5f2ec;color:#2a2c2e;font:15px/1.5 -apple-system,'Segoe UI',Roboto,sans-serif">` +
    `<div style="max-width:620px;margin:0 auto;background:#fffdf9;border:1px solid #d9d3c7;border-radius:6px;padding:24px">` +
    `<div style="font-weight:700;letter-spacing:.04em;color:#a35a2c;margin-bottom:16px">PORTOLAN</div>` +
    blocks.join("") +
    `</div></body></html>`
  );
}

const p = (html: string) => `<p style="margin:0 0 14px">${html}</p>`;

// ─── Shipped ────────────────────────────────────────────────────────────────

export type ShippedHead = {
  serial: string;
  castingNumber: string;
  ports: Array<{ port: Port; revisionLabel: string; cutOn: string }>;
  /** Flow results recorded on this head after cutting, already moved to 28 inH2O. */
  flow: Array<{ port: Port; peakCfmAt28: number; atLiftMm: number; testedOn: string }>;
};

export type ShippedMailInput = {
  shopName?: string;
  customerName: string;
  contactName?: string;
  jobNumber: string;
  castingNumber: string;
  heads: ShippedHead[];
  shippedOn: string;
};

export function shippedMail(input: ShippedMailInput): MailContent {
  const shop = input.shopName ?? "the shop";
  const subject = `Job ${input.jobNumber} has shipped: ${input.heads.length} ${input.heads.length === 1 ? "head" : "heads"} of casting ${input.castingNumber}`;
  const greeting = input.contactName?.trim() ? `Hello ${input.contactName.trim()},` : `Hello ${input.customerName},`;
  const opening = `${shop === "the shop" ? "We" : shop} shipped job ${input.jobNumber} on ${input.shippedOn}. This is the record of each head: the ports cut, the program revision that cut them, and flow results where the head was tested after cutting.`;
  const caution =
    "Flow figures are bench measurements corrected to 28 inH2O; they are estimates of the port, not a promise of engine power. Check valve-to-piston clearance and seat condition before assembly.";

  const lines: string[] = [greeting, "", opening, ""];
  const blocks: string[] = [p(esc(greeting)), p(esc(opening))];
  for (const head of input.heads) {
    lines.push(`Head ${head.serial} (casting ${head.castingNumber})`);
    const items: string[] = [];
    for (const port of head.ports) {
      const line = `${PORT_LABEL[port.port]} ports cut with ${port.revisionLabel} on ${port.cutOn}`;
      lines.push(`  - ${line}`);
      items.push(`<li>${esc(line)}</li>`);
    }
    for (const f of head.flow) {
      const line = `${PORT_LABEL[f.port]} flow ${f.peakCfmAt28.toFixed(1)} cfm at 28 inH2O (lift ${f.atLiftMm.toFixed(2)} mm), tested ${f.testedOn}`;
      lines.push(`  - ${line}`);
      items.push(`<li>${esc(line)}</li>`);
    }
    if (head.flow.length === 0) {
      lines.push("  - No flow test recorded on this head.");
      items.push("<li>No flow test recorded on this head.</li>");
    }
    lines.push("");
    blocks.push(`<p style="margin:0 0 6px;font-weight:600">Head ${esc(head.serial)} (casting ${esc(head.castingNumber)})</p><ul style="margin:0 0 14px;padding-left:20px">${items.join("")}</ul>`);
  }
  lines.push(caution, "");
  blocks.push(`<p style="margin:18px 0 0;font-size:13px;color:#5b5e62">${esc(caution)}</p>`);
  return { subject, text: lines.join("\n"), html: page(subject, blocks) };
}

// ─── A revision in use changed ──────────────────────────────────────────────

export type RevisionChangeMailInput = {
  revisionLabel: string;
  newState: "superseded" | "withdrawn";
  reason?: string | null;
  jobs: Array<{ number: string; customerName: string; state: string; link: string }>;
};

export function revisionChangedMail(input: RevisionChangeMailInput): MailContent {
  const stateWord = REVISION_STATE_LABEL[input.newState].toLowerCase();
  const n = input.jobs.length;
  const subject = `${input.revisionLabel} was ${stateWord}: ${n} open ${n === 1 ? "job uses" : "jobs use"} it`;
  const opening = `The program revision ${input.revisionLabel} was ${stateWord}${input.reason?.trim() ? ` (${input.reason.trim()})` : ""}. These open jobs still have it chosen and are flagged until a released revision is picked:`;
  const advice =
    "Stop cutting with the old program until the job has a released revision again; heads already cut keep the revision they were cut with, and the trace page lists them.";
  const text = [opening, "", ...input.jobs.map((j) => `  - Job ${j.number} for ${j.customerName} (${j.state}): ${checkedLink(j.link)}`), "", advice, ""].join("\n");
  const html = page(subject, [
    p(esc(opening)),
    `<ul style="margin:0 0 14px;padding-left:20px">${input.jobs
      .map((j) => `<li><a href="${esc(checkedLink(j.link))}" style="color:#a35a2c">Job ${esc(j.number)}</a> for ${esc(j.customerName)} (${esc(j.state)})</li>`)
      .join("")}</ul>`,
    p(esc(advice)),
  ]);
  return { subject, text, html };
}
