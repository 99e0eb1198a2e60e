"use client";

/**
 * The 3D stage every view shares: a Z-up perspective camera, orbit/pan/zoom, view presets and a
 * reset, rendered on demand (only when something changed — a software renderer would otherwise
 * redraw 200,000 segments sixty times a second for nothing). The drawing buffer is kept so a
 * screenshot (or a browser test) reads what is on screen.
 */
import { OrbitControls } from "@react-three/drei";
import { Canvas, useThree, type RootState } from "@react-three/fiber";
import { useEffect, useState } from "react";
import { PerspectiveCamera } from "three";
import type { OrbitControls as OrbitControlsImpl } from "three-stdlib";
import { Button } from "../ui/Button";
import { boxRadius, placeCamera, VIEW_PRESETS, type Box, type Vec3, type ViewPreset } from "./camera";

export const PAPER = "#f7f4ee";

export type ViewRequest = { preset: ViewPreset; seq: number };

function CameraRig({ request, box, portAxis }: { request: ViewRequest; box: Box; portAxis: Vec3 | null }) {
  // The camera and controls are three.js objects the rig moves imperatively; read through get().
  const get = useThree((s) => s.get);
  const ready = useThree((s) => s.controls !== null);
  useEffect(() => {
    if (!ready) return;
    placeView(get(), request.preset, box, portAxis);
  }, [ready, get, request.seq, request.preset, box, portAxis]);
  return null;
}

/** Puts the camera and the orbit target where the preset says, fitted to the box. */
function placeView(state: RootState, preset: ViewPreset, box: Box, portAxis: Vec3 | null) {
  const { camera, size, invalidate } = state;
  const controls = state.controls as OrbitControlsImpl | null;
  if (!controls) return;
  const aspect = size.width > 0 && size.height > 0 ? size.width / size.height : 1.5;
  const fov = camera instanceof PerspectiveCamera ? camera.fov : 40;
  const { position, target } = placeCamera(preset, box, fov, aspect, portAxis);
  const r = boxRadius(box);
  camera.near = Math.max(r / 2000, 1e-3);
  camera.far = r * 200;
  camera.position.set(...position);
  controls.target.set(...target);
  camera.updateProjectionMatrix();
  controls.update();
  invalidate();
}

export function useViewRequests(initial: ViewPreset = "three-quarter") {
  const [request, setRequest] = useState<ViewRequest>({ preset: initial, seq: 0 });
  return { request, show: (preset: ViewPreset) => setRequest((r) => ({ preset, seq: r.seq + 1 })) };
}

export function ViewButtons({ request, onShow, hasPortAxis = true }: { request: ViewRequest; onShow: (p: ViewPreset) => void; hasPortAxis?: boolean }) {
  return (
    <div className="flex flex-wrap items-center gap-1.5" role="group" aria-label="View">
      {VIEW_PRESETS.filter((p) => hasPortAxis || p.id !== "along-port").map((p) => (
        <Button key={p.id} variant={request.preset === p.id ? "primary" : "secondary"} className="min-h-9 px-3 text-xs" aria-pressed={request.preset === p.id} onClick={() => onShow(p.id)}>
          {p.label}
        </Button>
      ))}
      <Button variant="quiet" className="min-h-9 px-3 text-xs" onClick={() => onShow("three-quarter")}>
        Reset view
      </Button>
    </div>
  );
}

/** Re-renders the stage once after `deps` change (render-on-demand needs the nudge). */
export function useRedraw(deps: unknown[]) {
  const invalidate = useThree((s) => s.invalidate);
  // eslint-disable-next-line react-hooks/exhaustive-deps
  useEffect(() => invalidate(), deps);
}

export function Stage({
  box,
  portAxis,
  request,
  label,
  testId,
  onMoving,
  children,
}: {
  box: Box;
  portAxis: Vec3 | null;
  request: ViewRequest;
  /** Told when the user starts and stops turning, panning or zooming (to lighten heavy scenes). */
  onMoving?: (moving: boolean) => void;
  /** Says what the picture shows, for people who cannot see it; the numbers sit beside it. */
  label: string;
  testId: string;
  children: React.ReactNode;
}) {
  return (
    <div className="relative h-[58vh] min-h-80 w-full overflow-hidden rounded-md border border-rule bg-paper" data-testid={testId} role="img" aria-label={label}>
      <Canvas
        frameloop="demand"
        dpr={[1, 2]}
        gl={{ preserveDrawingBuffer: true, antialias: false }}
        camera={{ fov: 40, up: [0, 0, 1], position: [1, -1, 1] }}
        onCreated={({ gl }) => gl.setClearColor(PAPER)}
      >
        <ambientLight intensity={1} />
        <OrbitControls makeDefault enableDamping={false} onStart={onMoving && (() => onMoving(true))} onEnd={onMoving && (() => onMoving(false))} />
        <CameraRig request={request} box={box} portAxis={portAxis} />
        {children}
      </Canvas>
      <p className="pointer-events-none absolute bottom-1.5 left-2 rounded bg-paper/85 px-1.5 text-[11px] text-ink-soft">Drag to turn · right-drag or shift-drag to pan · wheel or pinch to zoom</p>
    </div>
  );
}
