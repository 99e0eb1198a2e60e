/**
 * E-mails about jobs, sent after the change they report has committed: a failure to send is
 * reported back (and logged), never allowed to undo the change.
 *  - the customer, when their job ships;
 *  - the leads, when a revision an open job still uses is superseded or withdrawn.
 */
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import { getJobRow, openJobsUsingRevision, revisionSummary } from "@/db/queries/jobs";
import { customers, cuts, flowPoints, flowTests, heads, users, type Port } from "@/db/schema";
import { tryComputeFlowTest } from "../flow";
import { sendMail, type Mailer } from "../mail";
import { env } from "../env";
import { revisionChangedMail, shippedMail, type ShippedHead } from "./mail";
import { JOB_STATE_LABEL } from "./words";

export type NoticeDeps = { mailer?: Mailer; appUrl?: string };

export type Notice = { sent: boolean; to: string[]; subject?: string; message?: string };

const day = (ms: number) => new Date(ms).toISOString().slice(0, 10);

/** One message per address (nobody sees the others'); never throws. */
async function deliver(to: string[], content: { subject: string; text: string; html: string }, mailer?: Mailer): Promise<Notice> {
  const failed: string[] = [];
  for (const address of to) {
    try {
      await sendMail({ to: address, ...content }, mailer);
    } catch (err) {
      failed.push(address);
      console.error(`[notice] "${content.subject}" to ${address} failed: ${err instanceof Error ? err.message : String(err)}`);
    }
  }
  if (failed.length === 0) return { sent: true, to, subject: content.subject };
  return { sent: failed.length < to.length, to, subject: content.subject, message: `The e-mail could not be sent to ${failed.join(", ")}.` };
}

/** Peak corrected flow of each flow test recorded on a head. */
function headFlowResults(db: Db, headId: number): ShippedHead["flow"] {
  const tests = db.select().from(flowTests).where(eq(flowTests.headId, headId)).orderBy(asc(flowTests.testedOn)).all();
  const out: ShippedHead["flow"] = [];
  for (const t of tests) {
    const points = db.select({ lift: flowPoints.liftMm, flow: flowPoints.flowCfm }).from(flowPoints).where(eq(flowPoints.flowTestId, t.id)).all();
    if (points.length === 0) continue;
    const ambient =
      t.tempC != null && t.baroKpa != null
        ? { temperature: t.tempC, temperatureUnit: "C" as const, pressure: t.baroKpa, pressureUnit: "kPa" as const, relativeHumidityPercent: t.rhPct ?? undefined }
        : undefined;
    const computed = tryComputeFlowTest({
      valveDiameter: t.valveDiameterMm,
      lengthUnit: "mm",
      depression: t.depressionInH2O,
      depressionUnit: "inH2O",
      ambient,
      liftUnit: "mm",
      flowUnit: "cfm",
      points,
    });
    if (!computed.ok) continue;
    out.push({ port: t.port, peakCfmAt28: computed.result.summary.peakFlowCfmAt28, atLiftMm: computed.result.summary.peakFlowLiftMm, testedOn: t.testedOn });
  }
  return out;
}

export async function sendShippedNotice(db: Db, jobId: number, deps: NoticeDeps = {}, now = Date.now()): Promise<Notice> {
  const job = getJobRow(db, jobId);
  if (!job) return { sent: false, to: [], message: "The job was not found." };
  const customer = db.select().from(customers).where(eq(customers.id, job.customerId)).get()!;
  if (!customer.email) return { sent: false, to: [], message: `${customer.name} has no e-mail address, so no shipping notice was sent.` };
  const shipped = db.select().from(heads).where(and(eq(heads.jobId, jobId), eq(heads.state, "shipped"))).orderBy(asc(heads.serial)).all();
  const list: ShippedHead[] = shipped.map((head) => {
    const good = db
      .select({ port: cuts.port, revisionId: cuts.revisionId, startedAt: cuts.startedAt })
      .from(cuts)
      .where(and(eq(cuts.headId, head.id), eq(cuts.outcome, "good")))
      .orderBy(desc(cuts.startedAt))
      .all();
    const latest = new Map<Port, (typeof good)[number]>();
    for (const c of good) if (!latest.has(c.port)) latest.set(c.port, c);
    const ports = [...latest.values()]
      .sort((a, b) => a.port.localeCompare(b.port))
      .reverse()
      .map((c) => ({ port: c.port, revisionLabel: revisionSummary(db, c.revisionId)?.label ?? `revision #${c.revisionId}`, cutOn: day(c.startedAt) }));
    return { serial: head.serial, castingNumber: head.castingNumber, ports, flow: headFlowResults(db, head.id) };
  });
  const content = shippedMail({
    customerName: customer.name,
    contactName: customer.contactName,
    jobNumber: job.number,
    castingNumber: job.castingNumber,
    heads: list,
    shippedOn: day(now),
  });
  return deliver([customer.email], content, deps.mailer);
}

/** Active leads, or the administrators when the shop has no lead. */
function leadAddresses(db: Db): string[] {
  const leads = db.select({ email: users.email }).from(users).where(and(eq(users.role, "lead"), eq(users.active, true))).all();
  if (leads.length) return leads.map((u) => u.email);
  return db
    .select({ email: users.email })
    .from(users)
    .where(and(inArray(users.role, ["admin"]), eq(users.active, true)))
    .all()
    .map((u) => u.email);
}

export type RevisionChangeNotice = Notice & { jobs: string[] };

/**
 * Call after a revision moved to superseded or withdrawn (the library's release and withdraw
 * verbs do): finds the open jobs still using it and e-mails the leads. Does nothing while the
 * revision is still usable. Never throws for a mail failure.
 */
export async function notifyJobsOfRevisionChange(db: Db, revisionId: number, deps: NoticeDeps = {}): Promise<RevisionChangeNotice> {
  const rev = revisionSummary(db, revisionId);
  if (!rev || (rev.state !== "superseded" && rev.state !== "withdrawn")) {
    return { sent: false, to: [], jobs: [], message: "The revision is not superseded or withdrawn; nobody to tell." };
  }
  const affected = openJobsUsingRevision(db, revisionId);
  if (affected.length === 0) return { sent: false, to: [], jobs: [], message: "No open job uses this revision." };
  const to = leadAddresses(db);
  const jobNumbers = affected.map((j) => j.number);
  if (to.length === 0) return { sent: false, to, jobs: jobNumbers, message: "There is no active lead or administrator to tell." };
  const base = (deps.appUrl ?? env().APP_URL).replace(/\/$/, "");
  const content = revisionChangedMail({
    revisionLabel: rev.label,
    newState: rev.state,
    reason: rev.endReason,
    jobs: affected.map((j) => ({ number: j.number, customerName: j.customerName, state: JOB_STATE_LABEL[j.state], link: `${base}/jobs/${j.id}` })),
  });
  return { ...(await deliver(to, content, deps.mailer)), jobs: jobNumbers };
}
