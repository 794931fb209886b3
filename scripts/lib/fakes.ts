/**
 * Local stand-ins for hosted services (mail, payments, storage), started with the app for the demo and tests.
 * Each fake registers here; none is needed yet.
 */
export interface RunningFakes {
  stop(): Promise<void>;
}

export async function startFakes(): Promise<RunningFakes> {
  const running: Array<{ stop(): Promise<void> }> = [];
  return {
    async stop() {
      await Promise.all(running.map((f) => f.stop()));
    },
  };
}
