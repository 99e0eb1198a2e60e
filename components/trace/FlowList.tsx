import type { TracedFlowTest } from "@/lib/trace/lineage";
import { PORT_LABEL } from "@/lib/jobs/words";

/** Flow tests as a compact table: what was tested, when, and the corrected peak. */
export function FlowList({ tests, empty }: { tests: TracedFlowTest[]; empty: string }) {
  if (tests.length === 0) return <p className="text-sm text-ink-faint">{empty}</p>;
  return (
    <table className="w-full text-sm">
      <thead className="text-left text-ink-soft">
        <tr>
          <th className="py-1 pr-3 font-semibold">Test</th>
          <th className="py-1 pr-3 font-semibold">Port</th>
          <th className="py-1 pr-3 font-semibold">Date</th>
          <th className="py-1 pr-3 text-right font-semibold">Peak, cfm at 28 inH₂O</th>
          <th className="py-1 text-right font-semibold">at lift, mm</th>
        </tr>
      </thead>
      <tbody>
        {tests.map((t) => (
          <tr key={t.id} className="border-t border-rule/60">
            <td className="py-1 pr-3">
              <a href={`/flow-tests/${t.id}`} className="underline decoration-copper/50 underline-offset-2">
                #{t.id} {t.subject}
              </a>
            </td>
            <td className="py-1 pr-3">{PORT_LABEL[t.port]}</td>
            <td className="py-1 pr-3">{t.testedOn}</td>
            <td className="py-1 pr-3 text-right font-mono">{t.peak ? t.peak.peakCfmAt28.toFixed(1) : "—"}</td>
            <td className="py-1 text-right font-mono">{t.peak ? t.peak.atLiftMm.toFixed(2) : "—"}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
