"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { callApi } from "@/lib/client/api";
import { putWithProgress } from "./put-with-progress";

async function thumbnailOf(file: File): Promise<Blob> {
  const bitmap = await createImageBitmap(file);
  const scale = Math.min(1, 320 / Math.max(bitmap.width, bitmap.height));
  const canvas = document.createElement("canvas");
  canvas.width = Math.max(1, Math.round(bitmap.width * scale));
  canvas.height = Math.max(1, Math.round(bitmap.height * scale));
  canvas.getContext("2d")!.drawImage(bitmap, 0, 0, canvas.width, canvas.height);
  return new Promise((resolve, reject) => canvas.toBlob((blob) => (blob ? resolve(blob) : reject(new Error("no thumbnail"))), "image/jpeg", 0.8));
}

/** Takes or picks a photo of the plot; the phone makes the thumbnail, storage gets both. */
export function PhotoPanel({ trialId, plotNumber, assessmentId }: { trialId: string; plotNumber: number; assessmentId: string | null }) {
  const router = useRouter();
  const [caption, setCaption] = useState("");
  const [progress, setProgress] = useState<number | null>(null);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);

  async function send(file: File) {
    setMessage(null);
    let thumbnail: Blob;
    try {
      thumbnail = await thumbnailOf(file);
    } catch {
      setMessage({ kind: "error", text: "That file could not be read as a photo. Use a JPEG, PNG or WebP image." });
      return;
    }
    const started = await callApi<{ photoId: string; putUrl: string; thumbnailPutUrl: string }>("/api/photos", {
      method: "POST",
      json: { trialId, plotNumber, assessmentId, contentType: file.type, sizeBytes: file.size, thumbnailBytes: thumbnail.size, caption },
    });
    if (!started.ok) {
      setMessage({ kind: "error", text: started.error.fields?.[0]?.message ?? started.error.message });
      return;
    }
    try {
      setProgress(0);
      await putWithProgress(started.data.thumbnailPutUrl, new File([thumbnail], "thumbnail.jpg"), "image/jpeg", () => {});
      await putWithProgress(started.data.putUrl, file, file.type, setProgress);
    } catch {
      setProgress(null);
      setMessage({ kind: "error", text: "The photo could not be sent. Check the connection and try again." });
      return;
    }
    const confirmed = await callApi(`/api/photos/${started.data.photoId}/confirm`, { method: "POST" });
    setProgress(null);
    if (!confirmed.ok) {
      setMessage({ kind: "error", text: confirmed.error.message });
      return;
    }
    setCaption("");
    setMessage({ kind: "ok", text: "Photo saved." });
    router.refresh();
  }

  return (
    <section className="space-y-3 rounded border border-soil-200 bg-white p-4" aria-labelledby="photo-heading">
      <h2 id="photo-heading" className="text-lg font-semibold">
        Add a photo
      </h2>
      <label className="block text-sm">
        <span className="mb-1 block font-medium">Caption (optional)</span>
        <input value={caption} onChange={(event) => setCaption(event.target.value)} maxLength={300} className="w-full rounded border border-soil-200 px-3 py-2" />
      </label>
      <label className="block text-sm">
        <span className="mb-1 block font-medium">Photo</span>
        <input
          type="file"
          accept="image/jpeg,image/png,image/webp"
          capture="environment"
          disabled={progress !== null}
          onChange={(event) => {
            const file = event.currentTarget.files?.[0];
            if (file) void send(file);
            event.currentTarget.value = "";
          }}
          className="block w-full text-sm file:mr-3 file:rounded file:border-0 file:bg-leaf-600 file:px-3 file:py-2 file:text-white"
        />
      </label>
      {progress !== null && <progress max={1} value={progress} className="h-3 w-full" aria-label="Photo upload progress" />}
      {message && (
        <p role={message.kind === "error" ? "alert" : "status"} className={`rounded px-3 py-2 text-sm ${message.kind === "error" ? "bg-red-50 text-red-800" : "bg-leaf-50 text-leaf-900"}`}>
          {message.text}
        </p>
      )}
    </section>
  );
}
