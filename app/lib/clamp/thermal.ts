// Preload change when hot, and losses from embedding and gasket relaxation.

export interface ThermalLayer {
  thicknessMm: number;
  /** Expansion coefficient in µm/(m·°C) (= 1e-6 per °C). */
  expansionUmPerMC: number;
  temperatureC: number;
}

/**
 * Preload change (N) from unequal expansion of members and stud.
 * Positive when the members grow more than the stud (an aluminium head on steel studs).
 */
export function thermalPreloadChangeN(a: {
  members: readonly ThermalLayer[];
  studLengthMm: number;
  studExpansionUmPerMC: number;
  studTemperatureC: number;
  assemblyTemperatureC: number;
  studComplianceMmPerN: number;
  memberComplianceMmPerN: number;
}): number {
  let memberGrowth = 0;
  for (const m of a.members) {
    memberGrowth += m.thicknessMm * m.expansionUmPerMC * 1e-6 * (m.temperatureC - a.assemblyTemperatureC);
  }
  const studGrowth = a.studLengthMm * a.studExpansionUmPerMC * 1e-6 * (a.studTemperatureC - a.assemblyTemperatureC);
  // VDI 2230 form (from memory), Bickford eqs. 11.12–11.13: ΔF = lK·(αP·ΔTP − αS·ΔTS)/(δS + δP), per layer
  return (memberGrowth - studGrowth) / (a.studComplianceMmPerN + a.memberComplianceMmPerN);
}

export type Roughness = "rz-under-10" | "rz-10-40" | "rz-40-160";

/** VDI 2230 embedding amounts (from memory), µm: thread, each head/nut bearing, each inner interface. */
export const EMBEDDING_UM: Record<Roughness, { thread: number; bearing: number; inner: number }> = {
  "rz-under-10": { thread: 3, bearing: 2.5, inner: 1.5 },
  "rz-10-40": { thread: 3, bearing: 3, inner: 2 },
  "rz-40-160": { thread: 3, bearing: 4, inner: 3 },
};

export function embeddingMm(roughness: Roughness, counts: { threads: number; bearings: number; innerInterfaces: number }): number {
  const e = EMBEDDING_UM[roughness];
  // VDI 2230 (from memory): fZ = Σ embedding amounts of the thread, bearings and inner interfaces
  return (e.thread * counts.threads + e.bearing * counts.bearings + e.inner * counts.innerInterfaces) / 1000;
}

export function embeddingLossN(embedMm: number, studComplianceMmPerN: number, memberComplianceMmPerN: number): number {
  // VDI 2230: FZ = fZ/(δS + δP)
  return embedMm / (studComplianceMmPerN + memberComplianceMmPerN);
}
