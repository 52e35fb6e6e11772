// How figures read inside the model's sentences (warnings, squeeze point, suggestions).
// SI by default; the app passes one in the person's display units. Pure: formatting only.
export interface Wording {
  torque(nm: number): string;
  force(n: number): string;
  stress(mpa: number): string;
  length(mm: number): string;
}

export const SI_WORDING: Wording = {
  torque: (x) => `${x.toFixed(0)} N·m`,
  force: (n) => `${(n / 1000).toFixed(1)} kN`,
  stress: (x) => `${x.toFixed(0)} MPa`,
  length: (x) => `${x.toFixed(3)} mm`,
};
