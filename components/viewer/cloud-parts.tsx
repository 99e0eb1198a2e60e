"use client";

/** three.js pieces of the point-cloud views: the points, the centerline, the section plane. */
import { useThree } from "@react-three/fiber";
import { useEffect, useMemo } from "react";
import * as THREE from "three";
import type { Vec3 } from "./camera";
import { outlineIn3d, type SectionLike } from "./sections";
import { PolylineObject } from "./scene-parts";

/** Points with one colour each (vertex colours) or one colour for all; size in screen pixels. */
export function PointsObject({ positions, colours, colour = "#8a8379", size = 2, opacity = 1 }: { positions: Float32Array; colours?: Float32Array | null; colour?: string; size?: number; opacity?: number }) {
  const invalidate = useThree((s) => s.invalidate);
  const geometry = useMemo(() => {
    const g = new THREE.BufferGeometry();
    g.setAttribute("position", new THREE.BufferAttribute(positions, 3));
    return g;
  }, [positions]);
  useEffect(() => {
    if (colours) geometry.setAttribute("color", new THREE.BufferAttribute(colours, 3));
    else geometry.deleteAttribute("color");
    invalidate();
  }, [geometry, colours, invalidate]);
  const material = useMemo(
    () => new THREE.PointsMaterial({ size, sizeAttenuation: false, vertexColors: !!colours, color: colours ? "#ffffff" : colour, transparent: opacity < 1, opacity, depthWrite: opacity >= 1 }),
    [size, colours, colour, opacity],
  );
  useEffect(() => () => geometry.dispose(), [geometry]);
  useEffect(() => () => material.dispose(), [material]);
  return <points geometry={geometry} material={material} />;
}

export function centerlinePoints(points: Vec3[]): Float32Array {
  return Float32Array.from(points.flat());
}

/** The section's plane as a translucent square, and its outline on it. */
export function SectionPlane({ section, halfSize, colour = "#b0592d" }: { section: SectionLike; halfSize: number; colour?: string }) {
  const invalidate = useThree((s) => s.invalidate);
  const matrix = useMemo(() => {
    const { origin, normal, u, v } = section.plane;
    const m = new THREE.Matrix4().makeBasis(new THREE.Vector3(...u), new THREE.Vector3(...v), new THREE.Vector3(...normal));
    m.setPosition(new THREE.Vector3(...origin));
    return m;
  }, [section]);
  const outline = useMemo(() => outlineIn3d(section), [section]);
  useEffect(() => invalidate(), [section, invalidate]);
  return (
    <>
      <mesh matrix={matrix} matrixAutoUpdate={false} renderOrder={1}>
        <planeGeometry args={[2 * halfSize, 2 * halfSize]} />
        <meshBasicMaterial color={colour} transparent opacity={0.16} side={THREE.DoubleSide} depthWrite={false} />
      </mesh>
      <PolylineObject points={outline} colour={colour} closed />
    </>
  );
}
