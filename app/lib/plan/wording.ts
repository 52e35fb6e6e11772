// The model's sentences in the person's display units.
import type { Wording } from "../clamp";
import { formatQuantity, type UnitSystem } from "../units";

export function displayWording(system: UnitSystem): Wording {
  return {
    torque: (nm) => formatQuantity(nm, "torque", system),
    force: (n) => formatQuantity(n, "force", system),
    stress: (mpa) => formatQuantity(mpa, "stress", system),
    length: (mm) => formatQuantity(mm, "smallLength", system),
    pressure: (mpa) => formatQuantity(mpa, "pressure", system),
  };
}
