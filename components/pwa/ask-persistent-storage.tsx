"use client";

import { useEffect } from "react";
import { askPersistentStorageOnce } from "./storage";

/** Rendered by the bench once a signed-in user is known: asks once to keep the device store (see /bench/device). */
export function AskPersistentStorage() {
  useEffect(() => {
    void askPersistentStorageOnce().catch(() => undefined);
  }, []);
  return null;
}
