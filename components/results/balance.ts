"use client";

import { useCallback, useSyncExternalStore } from "react";
import { BALANCE_RESOLUTIONS, DEFAULT_BALANCE_RESOLUTION } from "@/lib/format";

const KEY = "gelwright.balanceResolution";
const listeners = new Set<() => void>();

function read(): number {
  try {
    const value = Number(window.localStorage.getItem(KEY));
    return (BALANCE_RESOLUTIONS as readonly number[]).includes(value) ? value : DEFAULT_BALANCE_RESOLUTION;
  } catch {
    return DEFAULT_BALANCE_RESOLUTION;
  }
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  window.addEventListener("storage", listener);
  return () => {
    listeners.delete(listener);
    window.removeEventListener("storage", listener);
  };
}

/** The balance resolution the user chose (g), remembered in this browser. */
export function useBalanceResolution(): [number, (value: number) => void] {
  const value = useSyncExternalStore(subscribe, read, () => DEFAULT_BALANCE_RESOLUTION);
  const set = useCallback((next: number) => {
    try {
      window.localStorage.setItem(KEY, String(next));
    } catch {
      // Private mode: the choice lasts for this page only.
    }
    listeners.forEach((l) => l());
  }, []);
  return [value, set];
}
