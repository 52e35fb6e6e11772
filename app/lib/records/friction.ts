// The shop's own friction, learned from assemblies where stud stretch was measured at a known torque.
// Pure; SI (N·m, N, mm). Each such assembly gives an observed preload F = k·δ (the model's stud
// stiffness); the friction that best explains the torques the shop used is fitted through the same
// long-form torque equation the clamp model uses (app/lib/clamp/torque.ts).
import { equivalentNutFactor, preloadFromTorque, torquePerPreloadMm, type Friction, type TorqueGeometry } from "../clamp";

export interface FrictionObservation {
  torqueNm: number;
  /** Preload implied by the measured stretch (mean over the studs measured). */
  observedPreloadN: number;
  geometry: TorqueGeometry;
  diameterMm: number;
}

export const MIN_ASSEMBLIES_TO_LEARN = 3;

export type LearnedFriction =
  | {
      ok: true;
      /** One coefficient for thread and washer face alike (the same lubricant on both). */
      friction: number;
      /** Sample standard deviation of the per-assembly coefficients. */
      frictionSpread: number;
      nutFactor: number;
      nutFactorSpread: number;
      count: number;
    }
  | { ok: false; count: number; reason: string };

const sampleSd = (xs: number[]) => {
  const m = xs.reduce((a, b) => a + b, 0) / xs.length;
  return Math.sqrt(xs.reduce((a, x) => a + (x - m) ** 2, 0) / (xs.length - 1));
};

/**
 * The friction that best explains the observations: least squares on torque per preload, which the
 * long form makes linear in μ (T/F = P/2π + μ·[d2/(2·cos 30°) + DKm/2] with μG = μK = μ).
 * Refuses with fewer than MIN_ASSEMBLIES_TO_LEARN, or when the fit falls outside any real lubricant.
 */
export function learnFriction(obs: readonly FrictionObservation[]): LearnedFriction {
  const usable = obs.filter((o) => o.torqueNm > 0 && o.observedPreloadN > 0);
  if (usable.length < MIN_ASSEMBLIES_TO_LEARN)
    return {
      ok: false,
      count: usable.length,
      reason: `Needs stretch measured at a known torque on at least ${MIN_ASSEMBLIES_TO_LEARN} assemblies with this fastener and lubricant; there ${usable.length === 1 ? "is" : "are"} ${usable.length}.`,
    };
  let num = 0;
  let den = 0;
  const each: number[] = [];
  const nutFactors: number[] = [];
  for (const o of usable) {
    const y = (o.torqueNm * 1000) / o.observedPreloadN;
    const a = torquePerPreloadMm(o.geometry, { thread: 0, bearing: 0 });
    const b = torquePerPreloadMm(o.geometry, { thread: 1, bearing: 1 }) - a;
    num += b * (y - a);
    den += b * b;
    each.push((y - a) / b);
    // Shigley eq. 8-27: K = T/(F·d)
    nutFactors.push(y / o.diameterMm);
  }
  const friction = num / den;
  if (!(friction >= 0.02 && friction <= 0.6))
    return {
      ok: false,
      count: usable.length,
      reason: `The fit gives a friction of ${friction.toFixed(3)}, outside any real lubricant (0.02–0.6): check the stretch readings.`,
    };
  return {
    ok: true,
    friction,
    frictionSpread: sampleSd(each),
    nutFactor: nutFactors.reduce((a, b) => a + b, 0) / nutFactors.length,
    nutFactorSpread: sampleSd(nutFactors),
    count: usable.length,
  };
}

/** What the learned friction does to the preload at the maker's torque, against the handbook friction. */
export function preloadShift(torqueNm: number, geometry: TorqueGeometry, handbook: Friction, learned: number, diameterMm: number) {
  const handbookN = preloadFromTorque(torqueNm, geometry, handbook);
  const learnedN = preloadFromTorque(torqueNm, geometry, { thread: learned, bearing: learned });
  return {
    handbookN,
    learnedN,
    change: learnedN / handbookN - 1,
    handbookNutFactor: equivalentNutFactor(geometry, handbook, diameterMm),
  };
}
