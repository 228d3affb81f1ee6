/**
 * Study fields as an engineer names them, with their units — for the revision diff, the import preview and the
 * signed summary's list of changes.
 */

/** "$.structure.modes[1].frequency" → "structure › modes 2 › frequency", for people rather than parsers. */
function readablePath(path: string): string {
  return path
    .replace(/^\$\.?/, "")
    .replace(/\[(\d+)\]/g, (_, i: string) => ` ${Number(i) + 1}`)
    .split(".")
    .join(" › ");
}

const FIELD_LABELS: Record<string, string> = {
  name: "Document name",
  "air.density": "Air density ρ (kg/m³)",
  "deck.width": "Deck width B (m)",
  "deck.depth": "Deck depth D (m)",
  "structure.mass": "Mass m (kg/m)",
  "structure.inertia": "Inertia I (kg·m²/m)",
  "sweep.from": "Sweep from (m/s)",
  "sweep.to": "Sweep to (m/s)",
  "sweep.step": "Sweep step (m/s)",
  "aerodynamics.model": "Aerodynamic model",
  "aerodynamics.interpolation": "Interpolation in Ur",
  "aerodynamics.reducedVelocity": "Reduced velocities Ur",
  "aerodynamics.liftSlope": "Lift slope dC_L/dα (per rad)",
  "aerodynamics.dragCoefficient": "Drag coefficient C_D",
  "aerodynamics.momentSlope": "Moment slope dC_M/dα (per rad)",
  "aerodynamics.staticMomentSlope": "Static moment slope dC_M/dα (per rad)",
};

const MODE_FIELD_LABELS: Record<string, string> = {
  frequency: "frequency f (Hz)",
  damping: "damping ratio ζ",
  id: "name",
  dof: "degree of freedom",
};

/**
 * The name an engineer gives a study field, with its unit: "$.structure.modes[1].frequency" → "Mode 2
 * frequency f (Hz)", "$.aerodynamics.H3[4]" → "H3* at table row 5"; unknown paths fall back to `readablePath`.
 */
export function fieldLabel(path: string): string {
  const key = path.replace(/^\$\.?/, "");
  if (FIELD_LABELS[key]) return FIELD_LABELS[key];
  const mode = /^structure\.modes\[(\d+)\](?:\.(\w+))?$/.exec(key);
  if (mode) {
    const n = Number(mode[1]) + 1;
    return mode[2] ? `Mode ${n} ${MODE_FIELD_LABELS[mode[2]] ?? mode[2]}` : `Mode ${n}`;
  }
  const derivative = /^aerodynamics\.([HA][1-4])(?:\[(\d+)\])?$/.exec(key);
  if (derivative) return derivative[2] ? `${derivative[1]}* at table row ${Number(derivative[2]) + 1}` : `${derivative[1]}*`;
  const ur = /^aerodynamics\.reducedVelocity\[(\d+)\]$/.exec(key);
  if (ur) return `Ur at table row ${Number(ur[1]) + 1}`;
  return readablePath(path);
}
