/** What went wrong with the camera, in words that say what to do. */
export type CameraProblem = "denied" | "no-camera" | "busy" | "insecure" | "failed";

export function classifyCameraError(e: unknown): CameraProblem {
  const name = e instanceof DOMException || e instanceof Error ? e.name : "";
  if (name === "NotAllowedError" || name === "PermissionDeniedError" || name === "SecurityError") return "denied";
  if (name === "NotFoundError" || name === "DevicesNotFoundError" || name === "OverconstrainedError") return "no-camera";
  if (name === "NotReadableError" || name === "TrackStartError" || name === "AbortError") return "busy";
  return "failed";
}

export const CAMERA_PROBLEM_TEXT: Record<CameraProblem, { title: string; body: string }> = {
  denied: {
    title: "The camera is blocked for Benchwright",
    body:
      "To allow it: tap the lock or settings icon beside the web address, set Camera to Allow, then tap Try again. " +
      "On a phone you may also need to allow the camera for the browser in the phone's settings. Or type the tag code below.",
  },
  "no-camera": {
    title: "No camera found",
    body: "This device has no camera the browser can use. Type the tag code below.",
  },
  busy: {
    title: "The camera could not start",
    body: "Another app may be using it. Close that app and tap Try again, or type the tag code below.",
  },
  insecure: {
    title: "The camera needs a secure connection",
    body: "Open Benchwright over https to scan. Until then, type the tag code below.",
  },
  failed: {
    title: "The camera could not start",
    body: "Tap Try again, or type the tag code below.",
  },
};
