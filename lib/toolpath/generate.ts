/**
 * A realistic-looking, entirely invented 5-axis port-finishing program, for the demo seed, the
 * tests and the benchmark. It sweeps rings around a made-up port (a bending, necked tube) with
 * several tools, tilting A and B as it goes, the way simultaneous 5-axis finishing output looks.
 *
 * Streams text chunks so a 10-million-line program never sits in memory, and emits exactly
 * `lines` lines when `lines` is at least `minimumLines(tools)`.
 */

export type PortProgramOptions = {
  /** Total number of lines to emit. */
  lines: number;
  /** Number of tools (1–9). Default 3. */
  tools?: number;
  /** Seed of the small random wobble; the same seed gives the same program. Default 1. */
  seed?: number;
  units?: "mm" | "inch";
  port?: "intake" | "exhaust";
  /** Approximate size of each yielded chunk, in characters. Default 64 KiB. */
  chunkChars?: number;
};

const HEADER_LINES = 6;
const FOOTER_LINES = 4;
const TOOL_OVERHEAD_LINES = 13;
/** Points around one ring; small programs use fewer so they still sweep along the port. */
const MAX_POINTS_PER_RING = 240;
const MIN_POINTS_PER_RING = 24;
const MIN_RINGS = 8;

type ToolSpec = { label: string; radius: number; rpm: number; feed: number; plunge: number };

// Invented tooling: ball and lollipop cutters of decreasing size.
const TOOLING: ToolSpec[] = [
  { label: "10 MM BALL ROUGH", radius: 5, rpm: 14000, feed: 2400, plunge: 600 },
  { label: "8 MM BALL SEMI-FINISH", radius: 4, rpm: 16000, feed: 2000, plunge: 500 },
  { label: "6 MM LOLLIPOP FINISH", radius: 3, rpm: 18000, feed: 1600, plunge: 400 },
  { label: "5 MM LOLLIPOP SHORT SIDE", radius: 2.5, rpm: 20000, feed: 1400, plunge: 350 },
  { label: "4 MM BALL BOWL BLEND", radius: 2, rpm: 22000, feed: 1200, plunge: 300 },
  { label: "3 MM BALL GUIDE BOSS", radius: 1.5, rpm: 24000, feed: 1000, plunge: 250 },
  { label: "6 MM TAPER ROOF", radius: 3, rpm: 18000, feed: 1500, plunge: 400 },
  { label: "4 MM LOLLIPOP ROOF", radius: 2, rpm: 22000, feed: 1100, plunge: 300 },
  { label: "2 MM BALL DETAIL", radius: 1, rpm: 26000, feed: 800, plunge: 200 },
];

export function minimumLines(tools = 3): number {
  return HEADER_LINES + FOOTER_LINES + tools * (TOOL_OVERHEAD_LINES + 2);
}

export function* generatePortProgram(options: PortProgramOptions): Generator<string> {
  const tools = Math.max(1, Math.min(TOOLING.length, Math.floor(options.tools ?? 3)));
  const total = Math.max(Math.floor(options.lines), minimumLines(tools));
  const inch = options.units === "inch";
  const exhaust = options.port === "exhaust";
  const random = mulberry32(options.seed ?? 1);
  const chunkChars = options.chunkChars ?? 1 << 16;
  const out = new ChunkWriter(chunkChars);
  const len = (mm: number) => (inch ? mm / 25.4 : mm);
  const L = (mm: number) => fixed(len(mm), inch ? 5 : 4);

  // ---- header (HEADER_LINES) ----
  out.line("%");
  out.line(`O${exhaust ? 2202 : 1101} (PORTOLAN SAMPLE - ${exhaust ? "EXHAUST" : "INTAKE"} PORT FINISH)`);
  out.line("(INVENTED DEMONSTRATION PROGRAM - NOT FOR ANY REAL HEAD)");
  out.line(`${inch ? "G20" : "G21"} G17 G90 G94 G40 G49 G80`);
  out.line("G54");
  out.line(`G0 ${inch ? "Z3.93701" : "Z100."}`);
  yield* out.drain(false);

  const cutLines = total - HEADER_LINES - FOOTER_LINES - tools * TOOL_OVERHEAD_LINES;
  for (let t = 0; t < tools; t++) {
    const spec = TOOLING[t];
    const budget = Math.floor(cutLines / tools) + (t < cutLines % tools ? 1 : 0);
    // ---- tool overhead (TOOL_OVERHEAD_LINES, with the cut lines in between) ----
    out.line(`(TOOL ${t + 1}: ${spec.label})`);
    out.line(`T${t + 1} M6`);
    out.line(`S${spec.rpm} M3`);
    out.line("M8");
    out.line(`G43 H${t + 1} ${inch ? "Z3.93701" : "Z100."}`);
    const first = portPoint(0, 0, spec.radius, exhaust, 0);
    out.line(`G0 A${fixed(first.a, 3)} B${fixed(first.b, 3)}`);
    out.line(`G0 X${L(first.x)} Y${L(first.y)}`);
    out.line(`G0 Z${L(first.z + 5)}`);
    out.line(`G1 Z${L(first.z)} F${fixed(len(spec.plunge), inch ? 2 : 1)}`);
    // the cut: rings from the port entry towards the bowl, one point per line
    const perRing = Math.max(MIN_POINTS_PER_RING, Math.min(MAX_POINTS_PER_RING, Math.floor(budget / MIN_RINGS)));
    const rings = Math.max(1, Math.ceil(budget / perRing));
    let emitted = 0;
    let feedWritten = false;
    for (let ring = 0; ring < rings && emitted < budget; ring++) {
      const s = rings === 1 ? 0 : ring / (rings - 1);
      const wobble = (random() - 0.5) * 0.02;
      const step = (2 * Math.PI) / perRing;
      for (let k = 0; k < perRing && emitted < budget; k++) {
        const theta = step * (k + 1);
        const p = portPoint(s, theta, spec.radius, exhaust, wobble);
        const slow = Math.cos(theta) < -0.7; // the short-side turn is cut slower
        let text = `X${L(p.x)} Y${L(p.y)} Z${L(p.z)} A${fixed(p.a, 3)} B${fixed(p.b, 3)}`;
        if (!feedWritten) {
          text = `G1 ${text} F${fixed(len(spec.feed), inch ? 2 : 0)}`;
          feedWritten = true;
        } else if (slow && Math.cos(theta - step) >= -0.7) {
          text += ` F${fixed(len(spec.feed * 0.6), inch ? 2 : 0)}`;
        } else if (!slow && Math.cos(theta - step) < -0.7) {
          text += ` F${fixed(len(spec.feed), inch ? 2 : 0)}`;
        }
        out.line(text);
        emitted++;
      }
      if (out.full) yield* out.drain(false);
    }
    out.line(`G0 ${inch ? "Z3.93701" : "Z100."}`);
    out.line("M9");
    out.line("M5");
    out.line(`(END TOOL ${t + 1})`);
    yield* out.drain(false);
  }
  // ---- footer (FOOTER_LINES) ----
  out.line("G49 G0 A0. B0.");
  out.line("(CHECK PORT WALLS AND SEATS BEFORE RELEASE)");
  out.line("M30");
  out.line("%");
  yield* out.drain(true);
}

type PortPoint = { x: number; y: number; z: number; a: number; b: number };

/**
 * The tool-centre point at station s (0 entry … 1 bowl) and angle theta around an invented
 * port: the centreline bends down through the short-side turn, the section necks at mid-port.
 */
function portPoint(s: number, theta: number, toolRadius: number, exhaust: boolean, wobble: number): PortPoint {
  const reach = exhaust ? 52 : 68;
  const drop = exhaust ? 26 : 34;
  const cx = reach * s;
  const cz = -drop * s * s;
  // unit tangent of the centreline and a normal in the XZ plane
  const tx = reach;
  const tz = -2 * drop * s;
  const tl = Math.hypot(tx, tz);
  const nx = -tz / tl;
  const nz = tx / tl;
  const wall = 16 - 4 * Math.sin(Math.PI * s) + wobble;
  const r = Math.max(wall - toolRadius, 0.5);
  const cos = Math.cos(theta);
  const sin = Math.sin(theta);
  return {
    x: cx + r * cos * nx,
    y: 1.15 * r * sin,
    z: cz + r * cos * nz - 40,
    a: -Math.atan2(tz, tx) * (180 / Math.PI) + 8 * cos,
    b: 12 * sin * (1 - 0.5 * s),
  };
}

class ChunkWriter {
  private parts: string[] = [];
  private size = 0;
  constructor(private readonly chunkChars: number) {}
  line(text: string): void {
    this.parts.push(text);
    this.size += text.length + 1;
  }
  get full(): boolean {
    return this.size >= this.chunkChars;
  }
  *drain(force: boolean): Generator<string> {
    if (this.parts.length === 0 || (!force && !this.full)) return;
    yield this.parts.join("\n") + "\n";
    this.parts = [];
    this.size = 0;
  }
}

/** Fixed-point text without exponent notation, trailing zeros kept short ("12.5", "-0.0031", "7."). */
export function fixed(value: number, decimals: number): string {
  const scale = 10 ** decimals;
  let n = Math.round(value * scale);
  if (n === 0) return "0.";
  const negative = n < 0;
  if (negative) n = -n;
  const whole = Math.floor(n / scale);
  let frac = n - whole * scale;
  let digits = decimals;
  while (digits > 0 && frac % 10 === 0) {
    frac /= 10;
    digits--;
  }
  const fracText = digits > 0 ? String(frac).padStart(digits, "0") : "";
  if (whole === 0 && fracText) return `${negative ? "-" : ""}.${fracText}`;
  return `${negative ? "-" : ""}${whole}.${fracText}`;
}

/** Small deterministic PRNG (mulberry32). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
