/**
 * Words and unit of a figure an exploration shows (an output key of
 * lib/explore/spec.ts). Until the output catalogue is merged: the key's own
 * words, no unit.
 */
import type { OutputInfo } from "@/lib/explore/types";

/** The figure's label and unit. */
export function outputWords(key: string): OutputInfo {
  const words = key.replace(/:.*$/, "").replace(/([a-z])([A-Z])/g, "$1 $2").toLowerCase();
  return { key, label: words.charAt(0).toUpperCase() + words.slice(1), unit: "" };
}
