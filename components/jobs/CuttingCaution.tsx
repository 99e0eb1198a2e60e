import { Caution } from "../ui/Card";

/** The cautions wherever the product hands a program to the machine or records metal removal. */
export function CuttingCaution({ firstArticle = true, compact = false }: { firstArticle?: boolean; compact?: boolean }) {
  if (compact) {
    return (
      <Caution title="Caution">
        {firstArticle && <p>First head of the job: first-article check before cutting the rest.</p>}
        <p>Guards closed, eye protection on. Broke through into a water jacket or a seat? Stop, record it as scrap with the reason, tell the lead.</p>
      </Caution>
    );
  }
  return (
    <Caution title="Before and while cutting">
      {firstArticle && (
        <p>
          <strong>First-article check:</strong> inspect the first head of every job (wall thickness near the water jackets and the seats, port volume,
          short-side shape) before cutting the rest.
        </p>
      )}
      <p>Guards closed and interlocks working; eye protection inside the machine area. Never reach into a running cell.</p>
      <p>
        If the cutter breaks through into a water jacket or a seat, stop, record the head as scrap with the reason, and tell the lead before the next head:
        the casting may vary across the batch.
      </p>
      <p className="text-ink-soft">
        Planned times and flow figures are estimates; the inspection and the flow bench decide. Follow the machine builder&apos;s instructions, local codes and
        licensed practice.
      </p>
    </Caution>
  );
}
