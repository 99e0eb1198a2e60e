/**
 * Sorts the G and M codes of one block into their modal groups (RS274/NGC v3 §3.4, Table 4)
 * and finds the combinations the standard forbids. Codes the engine does not model are
 * reported here, once per line, so the interpreter only executes what it understands.
 */
import { AXIS_WORDS, type BlockWords, gName } from "./block";
import { GGroup, MGroup, gGroup, mGroup, usesAxisWords } from "./gcodes";
import type { WarningLog } from "./warnings";

/** The block's codes by group (G codes × 10; −1 = none in this block). Reused for every block. */
export class BlockPlan {
  motion = -1;
  /** 0 = G17, 1 = G18, 2 = G19. */
  plane = -1;
  distance = -1;
  arcDistance = -1;
  feedMode = -1;
  units = -1;
  comp = -1;
  lengthOffset = -1;
  coord = -1;
  dwell = false;
  /** 280 (G28) or 300 (G30). */
  home = -1;
  machineCoords = false;
  /** A non-modal code that takes the axis words for itself (G10, G28, G30, G92). */
  axisUser = -1;
  stop = -1;
  toolChange = false;
  spindle = -1;

  /** Fills the plan from `w`; returns why the block is invalid, or "" when it may run. */
  read(w: BlockWords, line: number, log: WarningLog): string {
    this.reset();
    let conflict = "";
    let seen = 0; // bit per modal group
    for (let i = 0; i < w.gCount; i++) {
      const g = w.gCodes[i];
      const group = gGroup(g);
      if (group !== GGroup.NonModal && group !== GGroup.Unknown) {
        if ((seen & (1 << group)) !== 0) conflict = `two G codes of modal group ${group} on one line`;
        seen |= 1 << group;
      }
      switch (group) {
        case GGroup.Motion: this.motion = g; break;
        case GGroup.Plane: this.plane = (g - 170) / 10; break;
        case GGroup.Distance: this.distance = g; break;
        case GGroup.ArcDistance: this.arcDistance = g; break;
        case GGroup.FeedMode: this.feedMode = g; break;
        case GGroup.Units: this.units = g; break;
        case GGroup.CutterComp: this.comp = g; break;
        case GGroup.LengthOffset: this.lengthOffset = g; break;
        case GGroup.CoordSystem: this.coord = g; break;
        case GGroup.ReturnMode: case GGroup.PathMode: break;
        case GGroup.NonModal:
          if (usesAxisWords(g)) {
            if (this.axisUser >= 0) conflict = `${gName(this.axisUser)} and ${gName(g)} on one line`;
            this.axisUser = g;
          }
          if (g === 40) this.dwell = true;
          else if (g === 280 || g === 300) this.home = g;
          else if (g === 530) this.machineCoords = true;
          else if (g === 100 || g === 920 || g === 921 || g === 922 || g === 923) {
            log.add("unsupported-code", line, () => `${gName(g)} (offsets) is not applied; later positions may be shifted`);
          }
          break;
        default:
          log.add("unknown-code", line, () => `${gName(g)} is not an RS274/NGC code the analysis knows; ignored`);
      }
    }
    if (this.axisUser >= 0 && this.motion >= 0 && this.motion !== 800 && (w.present & AXIS_WORDS) !== 0) {
      conflict = `${gName(this.axisUser)} and ${gName(this.motion)} both use the axis words`;
    }
    let mSeen = 0;
    for (let i = 0; i < w.mCount; i++) {
      const m = w.mCodes[i];
      const group = mGroup(m);
      if (group === MGroup.Unknown) {
        if (m === 98 || m === 99) {
          log.add("subroutine-not-supported", line, () => `M${m} (subprogram call/return) is not run; later positions may be wrong`);
        } else {
          log.add("unknown-code", line, () => `M${m} is not an RS274/NGC code; assumed to have no effect on motion`);
        }
        continue;
      }
      // one M code per group, except that M7 and M8 may share a line
      if ((mSeen & (1 << group)) !== 0 && group !== MGroup.Coolant) conflict = `two M codes of modal group ${group} on one line`;
      mSeen |= 1 << group;
      if (group === MGroup.Stop) this.stop = m;
      else if (group === MGroup.ToolChange) this.toolChange = true;
      else if (group === MGroup.Spindle) this.spindle = m;
    }
    return conflict;
  }

  private reset(): void {
    this.motion = -1;
    this.plane = -1;
    this.distance = -1;
    this.arcDistance = -1;
    this.feedMode = -1;
    this.units = -1;
    this.comp = -1;
    this.lengthOffset = -1;
    this.coord = -1;
    this.dwell = false;
    this.home = -1;
    this.machineCoords = false;
    this.axisUser = -1;
    this.stop = -1;
    this.toolChange = false;
    this.spindle = -1;
  }
}
