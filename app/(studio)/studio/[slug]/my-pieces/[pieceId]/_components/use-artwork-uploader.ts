import { generateReactHelpers } from "@uploadthing/react";
import { useEffect, useState, useSyncExternalStore } from "react";
import type { UploadRouter } from "@/app/api/uploadthing/core";

/**
 * Whether the uploader's route settings could not be loaded. The SDK asks for them once per
 * control (GET /api/uploadthing) and keeps a failure to itself, which would leave a control
 * waiting for good; this notes the failure so the control can say so.
 */
let settingsFailed = false;
const listeners = new Set<() => void>();
function noteSettings(failed: boolean) {
  if (settingsFailed === failed) return;
  settingsFailed = failed;
  for (const listener of listeners) listener();
}
function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** The SDK's own GET for route settings: the route's address with no query (uploads are POSTs). */
function isSettingsRequest(input: RequestInfo | URL, init?: RequestInit): boolean {
  const method = (init?.method ?? (input instanceof Request ? input.method : "GET")).toUpperCase();
  const href = input instanceof Request ? input.url : String(input);
  return method === "GET" && new URL(href, window.location.href).search === "";
}

const watchedFetch: typeof fetch = async (input, init) => {
  const settings = isSettingsRequest(input, init);
  // A fresh request (another page of the studio) starts with a clean slate.
  if (settings) noteSettings(false);
  try {
    const response = await fetch(input, init);
    if (settings && !response.ok) noteSettings(true);
    return response;
  } catch (error) {
    if (settings) noteSettings(true);
    throw error;
  }
};

const { useUploadThing } = generateReactHelpers<UploadRouter>({
  url: "/api/uploadthing",
  fetch: watchedFetch,
});

/**
 * - "preparing": the page is not live yet or the route settings are still on their way; a file
 *   chosen now would be lost, so the control waits (and holds a file chosen meanwhile).
 * - "ready": an upload can start.
 * - "unavailable": the settings could not be loaded; nothing can be sent until a reload.
 */
export type UploaderState = "preparing" | "ready" | "unavailable";

/** The artwork uploader for one page control, with whether it can upload yet. */
export function useArtworkUploader(options: {
  onUploadProgress: (percent: number) => void;
  onUploadError: (error: { code: string; message: string }) => void;
}) {
  const [live, setLive] = useState(false);
  useEffect(() => setLive(true), []);
  const failed = useSyncExternalStore(
    subscribe,
    () => settingsFailed,
    () => false,
  );
  const { startUpload, routeConfig } = useUploadThing("artworkPage", {
    uploadProgressGranularity: "fine",
    onUploadProgress: options.onUploadProgress,
    onUploadError: options.onUploadError,
  });
  const state: UploaderState =
    live && routeConfig ? "ready" : failed && !routeConfig ? "unavailable" : "preparing";
  return { state, startUpload };
}
