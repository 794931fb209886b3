/** A short beep (WebAudio) and a buzz on a good scan. Either may be missing or blocked; neither is required. */
export function scanFeedback(): void {
  try {
    navigator.vibrate?.(80);
  } catch {
    // no vibration motor, or not allowed
  }
  try {
    const Ctx =
      window.AudioContext ?? (window as unknown as { webkitAudioContext?: typeof AudioContext }).webkitAudioContext;
    if (!Ctx) return;
    const ctx = new Ctx();
    void ctx.resume().catch(() => undefined);
    const t = ctx.currentTime;
    const osc = ctx.createOscillator();
    const gain = ctx.createGain();
    osc.type = "sine";
    osc.frequency.value = 1320;
    gain.gain.setValueAtTime(0.0001, t);
    gain.gain.exponentialRampToValueAtTime(0.25, t + 0.01);
    gain.gain.exponentialRampToValueAtTime(0.0001, t + 0.14);
    osc.connect(gain).connect(ctx.destination);
    osc.start(t);
    osc.stop(t + 0.15);
    osc.onended = () => void ctx.close().catch(() => undefined);
  } catch {
    // audio not available
  }
}
