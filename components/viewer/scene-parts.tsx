"use client";

/** Small three.js pieces the views share: boxes, markers, polylines. */
import { useThree } from "@react-three/fiber";
import { useEffect, useMemo } from "react";
import * as THREE from "three";
import { boxEdges, type AxisBox } from "./boxes";
import type { Vec3 } from "./camera";

/** Frees GPU memory of objects built outside JSX when they are replaced or unmounted. */
export function useDisposable<T extends { dispose(): void }>(items: T[]) {
  useEffect(() => () => items.forEach((i) => i.dispose()), [items]);
}

export function BoxLines({ box, colour, dashed = false, dash = 1 }: { box: AxisBox; colour: string; dashed?: boolean; dash?: number }) {
  const object = useMemo(() => {
    const geometry = new THREE.BufferGeometry();
    geometry.setAttribute("position", new THREE.BufferAttribute(boxEdges(box), 3));
    const material = dashed ? new THREE.LineDashedMaterial({ color: colour, dashSize: dash, gapSize: dash * 0.7 }) : new THREE.LineBasicMaterial({ color: colour });
    const lines = new THREE.LineSegments(geometry, material);
    if (dashed) lines.computeLineDistances();
    return lines;
  }, [box, colour, dashed, dash]);
  useEffect(
    () => () => {
      object.geometry.dispose();
      (object.material as THREE.Material).dispose();
    },
    [object],
  );
  return <primitive object={object} />;
}

/** A polyline; `onTop` draws it through whatever is in front (a centerline inside a cloud). */
export function PolylineObject({ points, colour, closed = false, dashed = false, dash = 1, opacity = 1, onTop = false }: { points: Float32Array; colour: string; closed?: boolean; dashed?: boolean; dash?: number; opacity?: number; onTop?: boolean }) {
  const object = useMemo(() => {
    const geometry = new THREE.BufferGeometry();
    geometry.setAttribute("position", new THREE.BufferAttribute(points, 3));
    const common = { color: colour, transparent: opacity < 1 || onTop, opacity, depthTest: !onTop };
    const material = dashed ? new THREE.LineDashedMaterial({ ...common, dashSize: dash, gapSize: dash * 0.6 }) : new THREE.LineBasicMaterial(common);
    const line = closed ? new THREE.LineLoop(geometry, material) : new THREE.Line(geometry, material);
    if (dashed) line.computeLineDistances();
    line.renderOrder = onTop ? 10 : 2;
    return line;
  }, [points, colour, closed, dashed, dash, opacity, onTop]);
  useEffect(
    () => () => {
      object.geometry.dispose();
      (object.material as THREE.Material).dispose();
    },
    [object],
  );
  return <primitive object={object} />;
}

/** A solid ball (the tool's position while scrubbing) or a wire octahedron (a broken limit). */
export function Marker({ at, size, colour, shape = "ball" }: { at: Vec3; size: number; colour: string; shape?: "ball" | "diamond" }) {
  const invalidate = useThree((s) => s.invalidate);
  useEffect(() => invalidate(), [at, invalidate]);
  return (
    <mesh position={at}>
      {shape === "ball" ? <sphereGeometry args={[size, 16, 12]} /> : <octahedronGeometry args={[size, 0]} />}
      <meshBasicMaterial color={colour} wireframe={shape === "diamond"} />
    </mesh>
  );
}
