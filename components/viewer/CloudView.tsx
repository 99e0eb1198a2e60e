"use client";

/** The point-cloud view for pages: three.js and the viewer load only where this renders. */
import dynamic from "next/dynamic";
import { LoadProgress } from "./LoadProgress";

export const CloudView = dynamic(() => import("./CloudViewer"), {
  ssr: false,
  loading: () => <LoadProgress label="Loading the 3D viewer" fraction={null} detail="" />,
});

export const CloudCompareView = dynamic(() => import("./CloudCompareViewer"), {
  ssr: false,
  loading: () => <LoadProgress label="Loading the 3D viewer" fraction={null} detail="" />,
});
