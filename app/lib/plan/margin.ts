// A seal margin read against the plan's target, in the verdict's three words: the same rule the
// clamp model's verdict uses for the weakest cylinder (below 1 the seal opens; below the target it is thin).
import type { Status } from "../clamp";

export function marginStatus(margin: number, target: number): Status {
  return margin < 1 ? "short" : margin < target ? "thin" : "holds";
}

/** A probability as the estimate panel and the compare page show it: one decimal, in percent. */
export function chance(p: number): string {
  return `${(p * 100).toFixed(1)} %`;
}
