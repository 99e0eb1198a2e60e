"use client";

/**
 * The toolpath view as pages use it: a small wrapper that loads three.js and the viewer only when
 * it renders (next/dynamic, no server render), so no other page carries them in its bundle.
 */
import dynamic from "next/dynamic";
import { LoadProgress } from "./LoadProgress";

export const ToolpathView = dynamic(() => import("./ToolpathViewer"), {
  ssr: false,
  loading: () => <LoadProgress label="Loading the 3D viewer" fraction={null} detail="" />,
});
