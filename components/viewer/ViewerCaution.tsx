/** The cautions beside every view that shows sizes or paths that guide metal removal. */
import { Caution } from "../ui/Card";

export function ViewerCaution() {
  return (
    <Caution title="Pictures and figures are estimates">
      <p>The views draw decimated previews; sizes, areas and deviations are computed estimates. The flow bench and the inspection of a cut port decide.</p>
      <p>Before cutting with a new or changed program, check the wall thickness near the water jackets and the valve seats, and prove it with a first-article cut.</p>
      <p>Run the machine with the guards closed and eye protection on, and follow the machine builder&apos;s instructions, local codes and licensed practice.</p>
    </Caution>
  );
}
