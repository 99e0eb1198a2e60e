import { cx } from "./cx";

export type Tone = "neutral" | "copper" | "ok" | "warn" | "bad";

const tones: Record<Tone, string> = {
  neutral: "bg-paper-deep text-ink-soft border-rule",
  copper: "bg-copper-wash text-copper-deep border-copper/40",
  ok: "bg-ok-wash text-ok border-ok/30",
  warn: "bg-warn-wash text-warn border-warn/30",
  bad: "bg-bad-wash text-bad border-bad/30",
};

/** A state in words; the tint only supports the word. */
export function Badge({ tone = "neutral", children }: { tone?: Tone; children: React.ReactNode }) {
  return (
    <span className={cx("inline-flex items-center rounded border px-2 py-0.5 text-xs font-semibold uppercase tracking-wide", tones[tone])}>
      {children}
    </span>
  );
}
