"use client";

import { useRouter } from "next/navigation";
import { MultipartUploader } from "./MultipartUploader";

/** The multipart uploader on a record page: when the file is stored, the page shows it. */
export function UploadThenRefresh(props: { kind: "toolpath" | "point_cloud"; target: { revisionId: number } | { scanId: number }; label: string }) {
  const router = useRouter();
  return <MultipartUploader {...props} onDone={() => router.refresh()} />;
}
