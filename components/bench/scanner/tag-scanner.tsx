"use client";

/**
 * The tag scanner: rear camera (as a preference, never required), continuous decoding of Code 128 and QR with
 * @zxing/browser, the torch where the camera track has one, a beep and a buzz on success. The tag's check
 * character is verified (lib/trade/tag-code): a misread is refused and the camera keeps looking.
 *
 * Load it only when scanning (see ./index.tsx): @zxing stays out of the bench's first load.
 */
import { useEffect, useRef, useState } from "react";
import { BrowserMultiFormatReader, type IScannerControls } from "@zxing/browser";
import { BarcodeFormat, DecodeHintType } from "@zxing/library";
import { Flashlight, FlashlightOff, Keyboard, RotateCcw } from "lucide-react";
import { checkTagCode, formatTagCode } from "@/lib/trade/tag-code";
import { CAMERA_PROBLEM_TEXT, classifyCameraError, type CameraProblem } from "./camera-errors";
import { scanFeedback } from "./feedback";

export type TagScannerProps = {
  /** Called once with the normalized code (e.g. "HKRTNAD") of a tag whose check character is right. */
  onCode: (code: string) => void;
  /** The tech asked to type the code instead (e.g. focus the manual entry field). */
  onTypeInstead?: () => void;
};

type Status = "starting" | "looking" | "found" | CameraProblem;

const HINTS = new Map<DecodeHintType, unknown>([
  [DecodeHintType.POSSIBLE_FORMATS, [BarcodeFormat.CODE_128, BarcodeFormat.QR_CODE]],
  [DecodeHintType.TRY_HARDER, true],
]);

export default function TagScanner({ onCode, onTypeInstead }: TagScannerProps) {
  const videoRef = useRef<HTMLVideoElement>(null);
  const controlsRef = useRef<IScannerControls | null>(null);
  const onCodeRef = useRef(onCode);
  onCodeRef.current = onCode;
  const [attempt, setAttempt] = useState(0);
  const [status, setStatus] = useState<Status>("starting");
  const [torch, setTorch] = useState<{ available: boolean; on: boolean }>({ available: false, on: false });
  const [refused, setRefused] = useState<{ count: number; text: string; message: string } | null>(null);

  useEffect(() => {
    const video = videoRef.current;
    if (!video) return;
    if (!navigator.mediaDevices?.getUserMedia) {
      setStatus(window.isSecureContext ? "no-camera" : "insecure");
      return;
    }
    let cancelled = false;
    let done = false;
    setStatus("starting");
    setRefused(null);
    setTorch({ available: false, on: false });
    const reader = new BrowserMultiFormatReader(HINTS, { delayBetweenScanAttempts: 100 });
    reader
      .decodeFromConstraints({ audio: false, video: { facingMode: { ideal: "environment" } } }, video, (result, _error, controls) => {
        if (!result || done || cancelled) return;
        const text = result.getText();
        const checked = checkTagCode(text);
        if (!checked.ok) {
          // A misread or someone else's barcode: refuse it and keep looking.
          setRefused((prev) => ({ count: (prev?.count ?? 0) + 1, text, message: checked.message }));
          return;
        }
        done = true;
        controls.stop();
        scanFeedback();
        setStatus("found");
        onCodeRef.current(checked.value);
      })
      .then((controls) => {
        if (cancelled || done) {
          controls.stop();
          return;
        }
        controlsRef.current = controls;
        setTorch({ available: typeof controls.switchTorch === "function", on: false });
        setStatus("looking");
      })
      .catch((e: unknown) => {
        if (!cancelled) setStatus(classifyCameraError(e));
      });
    return () => {
      cancelled = true;
      controlsRef.current?.stop();
      controlsRef.current = null;
    };
  }, [attempt]);

  const toggleTorch = async () => {
    const c = controlsRef.current;
    if (!c?.switchTorch) return;
    try {
      await c.switchTorch(!torch.on);
      setTorch((t) => ({ ...t, on: !t.on }));
    } catch {
      setTorch({ available: false, on: false });
    }
  };

  const problem = status !== "starting" && status !== "looking" && status !== "found" ? CAMERA_PROBLEM_TEXT[status] : null;

  return (
    <section
      aria-label="Tag scanner"
      data-camera={status === "looking" ? "on" : status}
      data-refused={refused?.count ?? 0}
      className="flex flex-col gap-3"
    >
      <div className={`relative overflow-hidden rounded-2xl bg-black ${problem ? "hidden" : ""}`}>
        <video ref={videoRef} muted playsInline aria-label="Camera view" className="aspect-[4/3] w-full object-cover" />
        <div aria-hidden className="pointer-events-none absolute inset-x-[8%] top-1/2 h-1/3 -translate-y-1/2 rounded-xl border-4 border-white/90 shadow-[0_0_0_9999px_rgba(0,0,0,0.35)]" />
        {torch.available ? (
          <button
            type="button"
            aria-pressed={torch.on}
            onClick={toggleTorch}
            className="tap-bench absolute right-3 top-3 inline-flex items-center gap-2 rounded-2xl bg-black/70 px-4 text-lg font-bold text-white"
          >
            {torch.on ? <FlashlightOff aria-hidden size={24} /> : <Flashlight aria-hidden size={24} />}
            {torch.on ? "Light off" : "Light on"}
          </button>
        ) : null}
      </div>

      <p role="status" className="text-lg font-semibold">
        {status === "starting" ? "Starting the camera…" : null}
        {status === "looking" ? "Camera on: hold the tag's barcode inside the frame." : null}
        {status === "found" ? "Tag read." : null}
      </p>

      {refused && status === "looking" ? (
        <div role="alert" className="rounded-2xl border-l-8 border-bad bg-bad-soft px-4 py-3">
          <p className="text-lg font-bold">Misread refused: “{formatTagCode(refused.text)}”</p>
          <p>{refused.message} Still looking — hold the tag steady and closer.</p>
        </div>
      ) : null}

      {problem ? (
        <div role="alert" className="flex flex-col gap-3 rounded-2xl border-l-8 border-bad bg-bad-soft px-4 py-3">
          <p className="text-lg font-bold">{problem.title}</p>
          <p>{problem.body}</p>
          <div className="flex flex-wrap gap-3">
            {status !== "no-camera" && status !== "insecure" ? (
              <button
                type="button"
                onClick={() => setAttempt((n) => n + 1)}
                className="tap-bench inline-flex items-center gap-2 rounded-2xl border-2 border-line bg-surface px-5 text-lg font-bold"
              >
                <RotateCcw aria-hidden size={22} /> Try again
              </button>
            ) : null}
            {onTypeInstead ? (
              <button
                type="button"
                onClick={onTypeInstead}
                className="tap-bench inline-flex items-center gap-2 rounded-2xl bg-accent px-5 text-lg font-bold text-accent-ink"
              >
                <Keyboard aria-hidden size={22} /> Type the code
              </button>
            ) : null}
          </div>
        </div>
      ) : null}
    </section>
  );
}
