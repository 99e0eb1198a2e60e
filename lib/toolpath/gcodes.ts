/**
 * G and M codes by modal group (RS274/NGC v3, NISTIR 6556 Table 4), with codes stored as
 * ten times their value (G59.3 → 593). Codes the engine does not model are listed with the
 * reason, so they are reported rather than silently ignored.
 */

export enum GGroup {
  Unknown = -1,
  NonModal = 0,
  Motion = 1,
  Plane = 2,
  Distance = 3,
  ArcDistance = 4,
  FeedMode = 5,
  Units = 6,
  CutterComp = 7,
  LengthOffset = 8,
  ReturnMode = 10,
  CoordSystem = 12,
  PathMode = 13,
}

export function gGroup(code: number): GGroup {
  switch (code) {
    case 40: case 100: case 280: case 281: case 300: case 301: case 530:
    case 920: case 921: case 922: case 923:
      return GGroup.NonModal;
    case 0: case 10: case 20: case 30: case 382: case 800:
    case 810: case 820: case 830: case 840: case 850: case 860: case 870: case 880: case 890:
      return GGroup.Motion;
    case 170: case 180: case 190:
      return GGroup.Plane;
    case 900: case 910:
      return GGroup.Distance;
    case 901: case 911: // LinuxCNC arc-centre distance mode, not v3
      return GGroup.ArcDistance;
    case 930: case 940:
      return GGroup.FeedMode;
    case 200: case 210:
      return GGroup.Units;
    case 400: case 410: case 420:
      return GGroup.CutterComp;
    case 430: case 490:
      return GGroup.LengthOffset;
    case 980: case 990:
      return GGroup.ReturnMode;
    case 540: case 550: case 560: case 570: case 580: case 590: case 591: case 592: case 593:
      return GGroup.CoordSystem;
    case 610: case 611: case 640:
      return GGroup.PathMode;
    default:
      return GGroup.Unknown;
  }
}

/** Non-modal codes that take axis words for themselves (cannot share a line with a motion code). */
export function usesAxisWords(code: number): boolean {
  return code === 100 || code === 280 || code === 300 || code === 920;
}

export enum MGroup {
  Unknown = -1,
  Stop = 4,
  ToolChange = 6,
  Spindle = 7,
  Coolant = 8,
  Override = 9,
}

export function mGroup(code: number): MGroup {
  switch (code) {
    case 0: case 1: case 2: case 30: case 60:
      return MGroup.Stop;
    case 6:
      return MGroup.ToolChange;
    case 3: case 4: case 5:
      return MGroup.Spindle;
    case 7: case 8: case 9:
      return MGroup.Coolant;
    case 48: case 49:
      return MGroup.Override;
    default:
      return MGroup.Unknown;
  }
}
